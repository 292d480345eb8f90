import { fireEvent, screen } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest } from "./helpers";
import type { BoardDto } from "../../components/api/board";
import type { DispatchResult } from "../../components/api/dispatch";

const BOARD: BoardDto = {
  date: "2025-12-02",
  products: [
    { id: 101, name: "Milk-bread dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", total: 7 },
    { id: 102, name: "Brioche burger buns", saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns", total: 4 },
  ],
  rows: [
    { accountId: 12, accountName: "Juniper Table", orderId: 902, status: "locked", poNumber: "JT-9", quantities: { 101: 4, 102: 4 }, totalCents: 13600 },
    { accountId: 11, accountName: "Tidewater Café", orderId: 901, status: "locked", poNumber: null, quantities: { 101: 3 }, totalCents: 4860 },
    { accountId: 13, accountName: "North Pier Coffee", orderId: 903, status: "delivered", poNumber: null, quantities: { 101: 2 }, totalCents: 3600 },
  ],
  totalCents: 22060,
  held: [],
};

describe("confirm dispatch", () => {
  it("sends the short line with what went out and why, then shows the result", async () => {
    signedInAs(OWNER);
    let confirmed = false;
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/orders/board": () => ({ body: { board: confirmed ? { ...BOARD, rows: BOARD.rows.map((r) => ({ ...r, status: "delivered" })) } : BOARD } }),
      "POST /api/deliveries/:date/confirm": () => {
        confirmed = true;
        return { body: { result: { delivered: 2, invoices: ["HB-2025-00060"] } satisfies DispatchResult } };
      },
    });
    renderApp("/office/orders?date=2025-12-02");
    // The action is named after what it records (issue 10: "Dispatch vs delivery").
    expect(await screen.findByTestId("board-confirm-dispatch")).toHaveTextContent(/Record deliveries/);
    fireEvent.press(screen.getByTestId("board-confirm-dispatch"));
    expect(await screen.findByTestId("dispatch-summary")).toHaveTextContent("2 orders to record · everything as ordered.");
    expect(screen.getAllByText("Record deliveries").length).toBeGreaterThanOrEqual(1); // the page's overline
    expect(screen.getByTestId("dispatch-confirm")).toHaveTextContent(/Record deliveries/);
    // Orders already delivered show as such, without controls.
    expect(screen.getByTestId("dispatch-delivered-903")).toHaveTextContent(/North Pier Coffee.*Delivered/);
    expect(screen.queryByTestId("dispatch-short-903-101")).toBeNull();

    fireEvent.press(screen.getByTestId("dispatch-short-901-101"));
    // Starts at one fewer than ordered.
    expect(screen.getByTestId("dispatch-qty-901-101").props.value).toBe("2");
    fireEvent.press(screen.getByTestId("dispatch-qty-901-101-dec"));
    expect(screen.getByTestId("dispatch-qty-901-101").props.value).toBe("1");
    fireEvent.changeText(screen.getByTestId("dispatch-reason-901-101"), "Two trays scorched");
    expect(screen.getByTestId("dispatch-summary")).toHaveTextContent("2 orders to record · 1 line short.");

    fireEvent.press(screen.getByTestId("dispatch-confirm"));
    expect(await screen.findByTestId("dispatch-result")).toHaveTextContent(/2 orders marked delivered\. Invoiced at once \(card accounts\): HB-2025-00060\./);
    expect(api.callsTo("POST", "/api/deliveries/2025-12-02/confirm")[0].body).toEqual({ adjustments: [{ orderId: 901, productId: 101, deliveredQuantity: 1, reason: "Two trays scorched" }] });
    expect(await screen.findByTestId("dispatch-all-done")).toBeOnTheScreen();
  });

  it("won't send a short line that isn't short, and shows the server's line errors", async () => {
    signedInAs(OWNER);
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/orders/board": { body: { board: BOARD } },
      "POST /api/deliveries/:date/confirm": (_req: FakeRequest) => apiError(400, "validation_error", "Some adjustments need attention.", { "adjustments.0.orderId": "That order is not waiting for dispatch on this date." }),
    });
    renderApp("/office/dispatch?date=2025-12-02");
    fireEvent.press(await screen.findByTestId("dispatch-short-902-102"));
    fireEvent.changeText(screen.getByTestId("dispatch-qty-902-102"), "4");
    fireEvent.press(screen.getByTestId("dispatch-confirm"));
    expect(screen.getByTestId("dispatch-problem-902-102")).toHaveTextContent('Less than the 4 ordered, or untick "Short".');
    expect(api.callsTo("POST", "/api/deliveries/2025-12-02/confirm")).toHaveLength(0);

    fireEvent.changeText(screen.getByTestId("dispatch-qty-902-102"), "0");
    fireEvent.press(screen.getByTestId("dispatch-confirm"));
    expect(await screen.findByTestId("dispatch-problem-902-102")).toHaveTextContent("That order is not waiting for dispatch on this date.");
    expect(screen.getByTestId("dispatch-form-error")).toHaveTextContent(/Some adjustments need attention\./);
    expect(api.callsTo("POST", "/api/deliveries/2025-12-02/confirm")[0].body).toEqual({ adjustments: [{ orderId: 902, productId: 102, deliveredQuantity: 0 }] });
  });

  it("is the owner's: the bookkeeper sees no Record deliveries button", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/orders/board": { body: { board: BOARD } } });
    renderApp("/office/orders?date=2025-12-02");
    expect(await screen.findByTestId("board-csv")).toBeOnTheScreen();
    expect(screen.queryByTestId("board-confirm-dispatch")).toBeNull();
  });
});
