/**
 * The bakery's locale on the screens: the owner picks it in the calendar settings, and screens write dates in it.
 * Expected strings: Unicode CLDR via Node's ICU (en-US "EEE, MMM d" and "h:mm a"; en-GB "EEE d MMM" and "HH:mm").
 */
import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKERY, OWNER, SETTINGS, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { formatDay } from "../../components/ordering/dates";
import { setDisplayLocale } from "../../components/format";

beforeEach(() => signedInAs(OWNER));
afterEach(() => setDisplayLocale("en-US"));

describe("the bakery's locale", () => {
  it("the owner picks en-GB in the calendar settings; the save sends it and the screens follow the bakery", async () => {
    let bakery = BAKERY;
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/bakery": () => ({ body: { bakery } }),
      "GET /api/settings/calendar": { body: { settings: SETTINGS } },
      "PUT /api/settings/calendar": (req: { body: unknown }) => {
        bakery = { ...BAKERY, locale: (req.body as { locale: string }).locale };
        return { body: { settings: { ...SETTINGS, ...(req.body as object) } } };
      },
    });
    renderApp("/office/calendar");
    // The cut-off rule in the bakery's (en-US) time: the stored "14:00" reads "2:00 PM".
    expect(await screen.findByText("Orders close at 2:00 PM the day before delivery.")).toBeOnTheScreen();
    expect(screen.getByTestId("calendar-locale-en-US")).toBeChecked();
    expect(screen.getByTestId("calendar-locale-en-GB")).toHaveTextContent(/Tue 9 Jun · 14:00 · US\$1,234\.50/);
    fireEvent.press(screen.getByTestId("calendar-locale-en-GB"));
    fireEvent.press(screen.getByTestId("calendar-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/settings/calendar")).toHaveLength(1));
    expect(api.callsTo("PUT", "/api/settings/calendar")[0].body).toMatchObject({ locale: "en-GB" });
    // The bakery is fetched again and every screen's dates follow it.
    await waitFor(() => expect(formatDay("2025-12-03")).toBe("Wed 3 Dec"));
    expect(await screen.findByText("Orders close at 14:00 the day before delivery.")).toBeOnTheScreen();
  });

  it("until the bakery has loaded, screens write en-US", () => {
    expect(formatDay("2025-12-03")).toBe("Wed, Dec 3");
  });
});
