import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BUYER, account, buyerOrderingRoutes, calendarDay, mockApi, renderApp, signedInAs } from "./helpers";
import { invoiceDto } from "./billing-fixtures";

/** Issue 12, item 3: a buyer on credit hold sees what is owed, can pay from there, and meets switched-off ordering. */
beforeEach(() => signedInAs(BUYER));

const HELD = account({ status: "on_hold", creditHold: true });
const overdue = (n: number) =>
  Array.from({ length: n }, (_, i) => invoiceDto({ id: 41 + i, number: `HB-2025-0004${1 + i}`, overdue: true, dueDate: "2025-11-20", amountDueCents: 5873 + i * 1000 }));
const invoicesRoute = (list: ReturnType<typeof overdue>) => ({
  "GET /api/invoices": { body: { invoices: list, totals: { count: list.length, totalCents: 0, paidCents: 0, dueCents: 0 } } },
});

describe("credit hold", () => {
  it("the order screen says what is overdue, pays a single overdue invoice from there, and its ordering controls are off", async () => {
    const assign = jest.fn();
    const api = mockApi(
      buyerOrderingRoutes(calendarDay(), {
        "GET /api/accounts/:id": { body: { account: HELD } },
        ...invoicesRoute(overdue(1)),
        "POST /api/invoices/41/checkout": { body: { url: "http://127.0.0.1:1/pay/cs_test_1" } },
      }),
    );
    Object.defineProperty(window, "location", { value: { ...window.location, assign }, configurable: true });
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByText("$58.73 is overdue on 1 invoice. New orders and changes wait until it is paid; ordering opens again as soon as it is.")).toBeOnTheScreen();
    expect(screen.getByTestId("credit-hold-pay")).toHaveTextContent(/Pay \$58\.73 now/);
    expect(api.callsTo("GET", "/api/invoices")[0].query).toMatchObject({ overdue: "1" });
    // Ordering is visibly off: the steppers, the button (which says why) and no talk of the minimum.
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("order-submit")).toHaveTextContent(/Ordering on hold/);
    expect(screen.getByTestId("qty-101-inc")).toBeDisabled();
    expect(screen.getByTestId("order-blocked")).toHaveTextContent("On credit hold: ordering opens again as soon as the overdue invoices are paid.");
    expect(screen.queryByTestId("order-minimum")).toBeNull();
    fireEvent.press(screen.getByTestId("credit-hold-pay"));
    await waitFor(() => expect(api.callsTo("POST", "/api/invoices/41/checkout")).toHaveLength(1));
  });

  it("with several overdue invoices the home screen sums them and leads to the overdue list", async () => {
    const api = mockApi(buyerOrderingRoutes(calendarDay(), { "GET /api/accounts/:id": { body: { account: HELD } }, ...invoicesRoute(overdue(2)) }));
    const app = renderApp("/buyer");
    expect(await screen.findByText(/^\$127\.46 is overdue on 2 invoices\./)).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("credit-hold-pay"));
    await waitFor(() => expect(app.getPathname()).toBe("/buyer/invoices"));
    expect(await screen.findByTestId("invoices-screen")).toBeOnTheScreen();
    // The list opens on its Overdue filter (?show=overdue).
    await waitFor(() => expect(api.callsTo("GET", "/api/invoices").some((c) => c.query.overdue === "1" && c.query.sort === "newest")).toBe(true));
  });

  it("a pause by the bakery is not a credit hold: no amount, no pay button, its own words", async () => {
    mockApi(buyerOrderingRoutes(calendarDay(), { "GET /api/accounts/:id": { body: { account: account({ status: "on_hold", creditHold: false }) } } }));
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-account-note")).toHaveTextContent(/The bakery has paused this account\./);
    expect(screen.queryByTestId("credit-hold")).toBeNull();
    expect(screen.getByTestId("order-blocked")).toHaveTextContent("Paused by the bakery: call them to order again.");
    expect(screen.getByTestId("order-submit")).toBeDisabled();
  });
});
