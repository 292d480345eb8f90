import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BUYER, PRODUCTS, SETTINGS, account, apiError, mockApi, renderApp, sessionRoutes, signedInAs, standingDto } from "./helpers";
import { standingPayload } from "../../components/ordering/standing";
import type { StandingOrderDto } from "../../shared/schemas/orders";

function routes(standing: StandingOrderDto | null, extra = {}) {
  return {
    ...sessionRoutes(BUYER),
    "GET /api/accounts/:id": { body: { account: account() } },
    // Tidewater's route: Tuesday, Wednesday and Thursday.
    "GET /api/accounts/:id/delivery": { body: { delivery: { routeWeekdays: [2, 3, 4], minimumOrderCents: 5000, priceListId: null } } },
    "GET /api/settings/calendar": { body: { settings: SETTINGS } },
    "GET /api/products": { body: { products: PRODUCTS } },
    "GET /api/standing-orders": { body: { standingOrder: standing } },
    ...extra,
  };
}

beforeEach(() => signedInAs(BUYER));

describe("standing order grid", () => {
  it("shows one stepper per product and route weekday, and saves the grid as lines", async () => {
    const api = mockApi(routes(standingDto(), { "PUT /api/standing-orders": (req: { body: unknown }) => ({ body: { standingOrder: { ...standingDto(), ...(req.body as object) } } }) }));
    renderApp("/buyer/standing");
    expect(await screen.findByTestId("standing-cell-101-2")).toHaveDisplayValue("2");
    // Only the account's route days: no Friday or Saturday column.
    expect(screen.getByTestId("standing-cell-101-4")).toBeOnTheScreen();
    expect(screen.queryByTestId("standing-cell-101-5")).toBeNull();

    fireEvent.press(screen.getByTestId("standing-cell-101-4-inc"));
    fireEvent.press(screen.getByTestId("standing-cell-101-4-inc"));
    fireEvent.press(screen.getByTestId("standing-cell-102-3-inc")); // 0 → the minimum of 2
    fireEvent.press(screen.getByTestId("standing-interval-2"));
    fireEvent.changeText(screen.getByTestId("standing-end"), "2026-03-31");
    // Every other week from the week of Mon 1 Dec 2025 (RFC 5545 INTERVAL=2, WKST=MO): Thu 25 Dec is in the off week.
    fireEvent.changeText(screen.getByTestId("standing-skip-date"), "2025-12-25");
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    expect(screen.getByTestId("standing-skip-date-error")).toHaveTextContent("Thu, Dec 25 is not one of your delivery dates (every other week on Tue, Wed and Thu): nothing is made then.");
    fireEvent.changeText(screen.getByTestId("standing-skip-date"), "2025-12-18");
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    expect(screen.getByTestId("standing-skip-2025-12-18")).toBeOnTheScreen();
    expect(screen.getByTestId("standing-summary")).toHaveTextContent(/Every other week on Tue, Wed and Thu/);
    // The estimate is per delivery period: every other week, not "a week" (issue 12, item 5).
    expect(screen.getByTestId("standing-week-total")).toHaveTextContent(/^About \$[\d.,]+ every other week at today's prices\.$/);

    fireEvent.press(screen.getByTestId("standing-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/standing-orders")).toHaveLength(1));
    expect(api.callsTo("PUT", "/api/standing-orders")[0].body).toEqual({
      startDate: "2025-12-01",
      endDate: "2026-03-31",
      intervalWeeks: 2,
      skipDates: ["2025-12-18"],
      lines: [
        { productId: 101, weekday: 2, quantity: 2 },
        { productId: 101, weekday: 4, quantity: 2 },
        { productId: 102, weekday: 3, quantity: 2 },
      ],
      active: true,
    });
    expect(await screen.findByTestId("standing-saved")).toHaveTextContent(/Saved/);
  });

  it("lists the coming dates and marks the ones changed by hand", async () => {
    mockApi(routes(standingDto()));
    renderApp("/buyer/standing");
    expect(await screen.findByTestId("upcoming-2025-12-09")).toHaveTextContent(/Tue, Dec 9/);
    expect(screen.queryByTestId("upcoming-2025-12-09-edited")).toBeNull();
    expect(screen.getByTestId("upcoming-2025-12-16-edited")).toHaveTextContent("Changed by hand");
  });

  it("puts the server's per-line error on the product it names", async () => {
    mockApi(
      routes(null, {
        "PUT /api/standing-orders": apiError(400, "validation_failed", "There is no delivery to you on this weekday.", { "lines.0.weekday": "There is no delivery to you on this weekday." }),
      }),
    );
    renderApp("/buyer/standing");
    expect(await screen.findByTestId("standing-none")).toBeOnTheScreen();
    fireEvent.press(await screen.findByTestId("standing-cell-102-2-inc"));
    fireEvent.press(screen.getByTestId("standing-save"));
    expect(await screen.findByTestId("standing-product-102-error")).toHaveTextContent("Tuesday: There is no delivery to you on this weekday.");
  });

  it("puts the server's date errors beside the start date and the skip field, and checks a typed skip date", async () => {
    mockApi(
      routes(standingDto(), {
        "PUT /api/standing-orders": apiError(400, "validation_failed", "Check the dates.", { startDate: "Choose a date from tomorrow on.", "skipDates.0": "Use a date within the next two years." }),
      }),
    );
    renderApp("/buyer/standing");
    fireEvent.changeText(await screen.findByTestId("standing-skip-date"), "25/12/2025");
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    // The example is a week after the bakery's today (2 Dec 2025), never a date gone by.
    expect(screen.getByTestId("standing-skip-date-error")).toHaveTextContent("Write the date as YYYY-MM-DD, e.g. 2025-12-09.");
    fireEvent.changeText(screen.getByTestId("standing-skip-date"), "2025-12-02");
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    expect(screen.getByTestId("standing-skip-date-error")).toHaveTextContent("Choose a date after today.");
    // A Wednesday: the standing order delivers on Tuesdays only.
    fireEvent.changeText(screen.getByTestId("standing-skip-date"), "2027-12-01");
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    expect(screen.getByTestId("standing-skip-date-error")).toHaveTextContent("Wed, Dec 1 is not one of your delivery dates (every week on Tue): nothing is made then.");
    fireEvent.changeText(screen.getByTestId("standing-skip-date"), "2027-11-30");
    expect(screen.queryByTestId("standing-skip-date-error")).toBeNull();
    fireEvent.press(screen.getByTestId("standing-skip-add"));
    fireEvent.press(screen.getByTestId("standing-save"));
    expect(await screen.findByTestId("standing-start-error")).toHaveTextContent("Choose a date from tomorrow on.");
    expect(screen.getByTestId("standing-skip-date-error")).toHaveTextContent("Use a date within the next two years.");
    // Both have a place beside their inputs: nothing on top.
    expect(screen.queryByTestId("standing-error-message")).toBeNull();
  });

  it("hides the saved message again as soon as something changes", async () => {
    mockApi(routes(standingDto(), { "PUT /api/standing-orders": (req: { body: unknown }) => ({ body: { standingOrder: { ...standingDto(), ...(req.body as object) } } }) }));
    renderApp("/buyer/standing");
    fireEvent.press(await screen.findByTestId("standing-active-off"));
    fireEvent.press(screen.getByTestId("standing-save"));
    expect(await screen.findByTestId("standing-saved")).toHaveTextContent(/Saved\. Your standing order is paused: no new orders are made from it\./);
    fireEvent.press(screen.getByTestId("standing-cell-101-3-inc"));
    expect(screen.queryByTestId("standing-saved")).toBeNull();
  });

  it("checks quantities against the product's limits before sending", async () => {
    const api = mockApi(routes(null));
    renderApp("/buyer/standing");
    fireEvent.changeText(await screen.findByTestId("standing-cell-102-2"), "9");
    expect(screen.getByTestId("standing-product-102-error")).toHaveTextContent("Tuesday: At most 5 packs of 8 buns per order.");
    fireEvent.press(screen.getByTestId("standing-save"));
    expect(await screen.findByTestId("standing-error-message")).toBeOnTheScreen();
    expect(api.callsTo("PUT", "/api/standing-orders")).toHaveLength(0);
  });
});

describe("standingPayload", () => {
  it("keeps non-zero cells in product and weekday order, trims dates and sorts skips", () => {
    expect(
      standingPayload({
        products: [{ id: 7 }, { id: 3 }],
        weekdays: [2, 6],
        cells: { "3:6": "1", "7:2": "0", "7:6": "4", "3:2": "" },
        startDate: " 2025-12-02 ",
        endDate: "",
        intervalWeeks: 1,
        skipDates: ["2025-12-30", "2025-12-23", "2025-12-30"],
        active: false,
      }),
    ).toEqual({
      startDate: "2025-12-02",
      endDate: null,
      intervalWeeks: 1,
      skipDates: ["2025-12-23", "2025-12-30"],
      lines: [
        { productId: 7, weekday: 6, quantity: 4 },
        { productId: 3, weekday: 6, quantity: 1 },
      ],
      active: false,
    });
  });
});
