import { act, fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BUYER, account, buyerOrderingRoutes, calendarDay, mockApi, orderDto, renderApp, signedInAs } from "./helpers";

beforeEach(() => signedInAs(BUYER));

// The bakery's clock (helpers BAKERY): Tue, Dec 2, 2025, 5:30 AM in Chicago.
const DAYS = [
  calendarDay({ date: "2025-12-02", weekday: 2, orderable: false, reason: "past_cutoff", reasonText: "Past the cut-off", cutoffAt: "2025-12-01T14:00:00.000-06:00", order: { id: 500, status: "locked", totalCents: 5400, productCount: 1, source: "standing" } }),
  calendarDay({ date: "2025-12-03", weekday: 3, cutoffAt: "2025-12-02T06:10:00.000-06:00" }),
  calendarDay({ date: "2025-12-04", weekday: 4, cutoffAt: "2025-12-03T14:00:00.000-06:00", order: { id: 501, status: "open", totalCents: 9000, productCount: 2, source: "one_off" } }),
  calendarDay({ date: "2025-12-05", weekday: 5, orderable: false, reason: "not_delivery_day", reasonText: "No delivery on this day", cutoffAt: "2025-12-04T14:00:00.000-06:00" }),
  calendarDay({ date: "2025-12-25", weekday: 4, orderable: false, reason: "closed", reasonText: "The bakery is closed: Christmas", cutoffAt: "2025-12-24T14:00:00.000-06:00" }),
];

describe("buyer home", () => {
  it("lists the coming delivery dates with their status and a live countdown", async () => {
    const api = mockApi(buyerOrderingRoutes(DAYS[0], { "GET /api/calendar": { body: { days: DAYS } } }));
    renderApp("/buyer");
    expect(await screen.findByTestId("buyer-home-title")).toHaveTextContent("Tidewater Café");
    expect(await screen.findByTestId("day-2025-12-02-status")).toHaveTextContent(/Locked for baking/);
    expect(screen.getByTestId("day-2025-12-02")).toHaveTextContent(/Today · Tue, Dec 2/);
    expect(screen.getByTestId("day-2025-12-03-status")).toHaveTextContent(/Not ordered yet/);
    expect(screen.getByTestId("day-2025-12-04-status")).toHaveTextContent(/Order placed/);
    expect(screen.getByTestId("day-2025-12-04-summary")).toHaveTextContent("2 products · $90.00");
    expect(screen.getByTestId("day-2025-12-25-status")).toHaveTextContent(/The bakery is closed: Christmas/);
    // No delivery on Fridays for this account: not listed.
    expect(screen.queryByTestId("day-2025-12-05")).toBeNull();
    // 40 minutes left for tomorrow: urgent, with the cut-off in the bakery's zone.
    expect(screen.getByTestId("day-2025-12-03-countdown-text")).toHaveTextContent(/Closes in 40 min/);
    expect(screen.getByTestId("day-2025-12-03-countdown-at")).toHaveTextContent("Cut-off Tue, Dec 2, 6:10 AM CST");
    expect(screen.getByTestId("next-cutoff")).toHaveTextContent(/Tomorrow, Wednesday, December 3/);
    const q = api.callsTo("GET", "/api/calendar")[0].query;
    expect(q).toEqual({ from: "2025-12-02", to: "2025-12-15" });

    // It ticks.
    await act(async () => {
      jest.advanceTimersByTime(65_000);
    });
    await waitFor(() => expect(screen.getByTestId("day-2025-12-03-countdown-text")).toHaveTextContent(/Closes in 38 min 5\d s/));
  });

  it("opens the order screen for a date", async () => {
    mockApi(buyerOrderingRoutes(DAYS[1], { "GET /api/calendar": (req) => ({ body: { days: req.query.from === req.query.to ? [DAYS[1]] : DAYS } }) }));
    const app = renderApp("/buyer");
    fireEvent.press(await screen.findByTestId("day-2025-12-03"));
    expect(await screen.findByTestId("order-title")).toHaveTextContent("Wednesday, December 3");
    expect(app.getPathname()).toBe("/buyer/order/2025-12-03");
  });

  it("shows an error state with retry when the calendar fails", async () => {
    let fail = true;
    mockApi(buyerOrderingRoutes(DAYS[0], { "GET /api/calendar": () => (fail ? { status: 500, body: { error: { code: "internal_error", message: "Something went wrong on our side." } } } : { body: { days: DAYS } }) }));
    renderApp("/buyer");
    expect(await screen.findByTestId("deliveries-error")).toHaveTextContent(/Something went wrong on our side/);
    fail = false;
    fireEvent.press(screen.getByTestId("deliveries-error-retry"));
    expect(await screen.findByTestId("day-2025-12-04")).toBeOnTheScreen();
  });
});

describe("order history", () => {
  it("splits coming and past orders", async () => {
    mockApi(
      buyerOrderingRoutes(DAYS[0], {
        "GET /api/orders": {
          body: {
            orders: [
              orderDto({ id: 400, deliveryDate: "2025-11-27", status: "delivered" }),
              orderDto({ id: 401, deliveryDate: "2025-11-29", status: "cancelled" }),
              orderDto({ id: 501, deliveryDate: "2025-12-04", source: "standing", editedByHand: true }),
            ],
          },
        },
      }),
    );
    renderApp("/buyer/orders");
    expect(await screen.findByTestId("history-order-501")).toHaveTextContent(/Thu, Dec 4.*Order placed.*1 product · \$54\.00.*Milk-bread dinner rolls \(3 trays of 15 rolls\).*Standing order.*Changed by hand/);
    expect(screen.queryByTestId("history-order-400")).toBeNull();
    fireEvent.press(screen.getByTestId("history-show-past"));
    expect(screen.getByTestId("history-order-401-status")).toHaveTextContent(/Canceled/);
    expect(screen.getByTestId("history-order-400-status")).toHaveTextContent(/Delivered/);
  });

  it("back from a past order opened from Orders returns to Orders, not Home (issue 12)", async () => {
    const past = orderDto({ id: 400, deliveryDate: "2025-11-27", status: "delivered" });
    mockApi(
      buyerOrderingRoutes(calendarDay({ date: "2025-11-27", orderable: false, reason: "past_cutoff", order: { id: 400, status: "delivered", totalCents: 5400 } as never }), {
        "GET /api/orders": { body: { orders: [past] } },
        "GET /api/orders/:id": { body: { order: past } },
      }),
    );
    const app = renderApp("/buyer/orders");
    await screen.findByTestId("history-title");
    await waitFor(() => expect(screen.queryByTestId("history-loading")).toBeNull());
    fireEvent.press(await screen.findByTestId("history-show-past"));
    fireEvent.press(await screen.findByTestId("history-order-400"));
    await waitFor(() => expect(app.getPathname()).toBe("/buyer/order/2025-11-27"));
    const back = await screen.findByTestId("order-back");
    expect(back).toHaveTextContent("‹ Orders");
    fireEvent.press(back);
    await waitFor(() => expect(app.getPathname()).toBe("/buyer/orders"));
  });
});

describe("calendar feed on the account screen", () => {
  it("makes a link, shows it with copy and subscribe help, and turns it off", async () => {
    let url: string | null = null;
    const api = mockApi(
      buyerOrderingRoutes(DAYS[0], {
        "GET /api/accounts/:id": { body: { account: account() } },
        "GET /api/calendar-feed": () => ({ body: { url } }),
        "POST /api/calendar-feed": () => {
          url = "http://panwise.test/api/feeds/abcdefghijklmnopqrstuvwx.ics";
          return { status: 201, body: { url } };
        },
        "DELETE /api/calendar-feed": () => {
          url = null;
          return { status: 204 };
        },
      }),
    );
    renderApp("/buyer/account");
    fireEvent.press(await screen.findByTestId("feed-create"));
    expect(await screen.findByTestId("feed-url")).toHaveTextContent("http://panwise.test/api/feeds/abcdefghijklmnopqrstuvwx.ics");
    // Issue 10 item 4: general steps in our words, no one platform's settings menus.
    expect(screen.getByTestId("feed-step-2")).toHaveTextContent(/add a calendar by its link \(often called subscribing to a calendar\) and paste the link/);
    expect(screen.getByTestId("feed-help")).not.toHaveTextContent(/Settings ›|Add Subscribed Calendar|Other calendars|From URL|iPhone|Android/);
    expect(screen.getByTestId("feed-help")).toHaveTextContent(/webcal:\/\//);
    expect(screen.getByTestId("terms-minimum")).toHaveTextContent("$50.00");
    fireEvent.press(screen.getByTestId("feed-revoke"));
    fireEvent.press(screen.getByTestId("feed-confirm-yes"));
    expect(await screen.findByTestId("feed-none")).toBeOnTheScreen();
    expect(api.callsTo("DELETE", "/api/calendar-feed")).toHaveLength(1);
  });
});
