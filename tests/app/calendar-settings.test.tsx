/** The owner's delivery days (components/screens/settings): the settings form and its closed dates, both on the one form hook. */
import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKERY, OWNER, SETTINGS, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeReply, type FakeRequest } from "./helpers";

function routes(put: (req: FakeRequest) => FakeReply) {
  return { ...sessionRoutes(OWNER), "GET /api/bakery": { body: { bakery: BAKERY } }, "GET /api/settings/calendar": { body: { settings: SETTINGS } }, "PUT /api/settings/calendar": put };
}

beforeEach(() => signedInAs(OWNER));

describe("calendar settings", () => {
  it("adds a closed date only once and as a date, then saves the list with the rules", async () => {
    const api = mockApi(routes((req) => ({ body: { settings: { ...SETTINGS, ...(req.body as object) } } })));
    renderApp("/office/calendar");
    expect(await screen.findByTestId("closure-2025-12-25")).toHaveTextContent(/Christmas/);
    fireEvent.changeText(screen.getByTestId("closure-date"), "Dec 26");
    fireEvent.press(screen.getByTestId("closure-add"));
    expect(screen.getByTestId("closure-date-error")).toHaveTextContent("Write the date as YYYY-MM-DD (year, month, day).");
    fireEvent.changeText(screen.getByTestId("closure-date"), "2025-12-25");
    expect(screen.queryByTestId("closure-date-error")).toBeNull();
    fireEvent.press(screen.getByTestId("closure-add"));
    expect(screen.getByTestId("closure-date-error")).toHaveTextContent("That date is already on the list.");
    fireEvent.changeText(screen.getByTestId("closure-date"), "2025-12-26");
    fireEvent.changeText(screen.getByTestId("closure-note"), "  Boxing Day ");
    fireEvent.press(screen.getByTestId("closure-add"));
    expect(await screen.findByTestId("closure-2025-12-26")).toHaveTextContent(/Boxing Day/);
    expect(screen.getByTestId("closure-date")).toHaveDisplayValue("");
    fireEvent.changeText(screen.getByTestId("calendar-lead"), "2");
    fireEvent.press(screen.getByTestId("calendar-save"));
    expect(await screen.findByTestId("calendar-saved")).toHaveTextContent(/Delivery days saved/);
    expect(api.callsTo("PUT", "/api/settings/calendar")[0].body).toMatchObject({
      timeZone: "America/Chicago",
      leadDays: 2,
      horizonDays: 28,
      closures: [
        { date: "2025-12-25", note: "Christmas" },
        { date: "2025-12-26", note: "Boxing Day" },
      ],
    });
  });

  it("checks the rules with the shared schema, and puts the server's field errors beside them", async () => {
    const api = mockApi(routes(() => apiError(400, "validation_failed", "Check the highlighted fields.", { horizonDays: "At most 120 days." })));
    renderApp("/office/calendar");
    fireEvent.changeText(await screen.findByTestId("calendar-cutoff"), "2pm");
    fireEvent.press(screen.getByTestId("calendar-save"));
    expect(screen.getByTestId("calendar-cutoff-error")).toBeOnTheScreen();
    expect(api.callsTo("PUT", "/api/settings/calendar")).toHaveLength(0);
    fireEvent.changeText(screen.getByTestId("calendar-cutoff"), "15:00");
    fireEvent.press(screen.getByTestId("calendar-save"));
    expect(await screen.findByTestId("calendar-horizon-error")).toHaveTextContent("At most 120 days.");
    await waitFor(() => expect(screen.queryByTestId("calendar-form-error")).toBeNull());
  });
});
