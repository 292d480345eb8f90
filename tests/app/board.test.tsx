import { Dimensions } from "react-native";
import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKER, BOOKKEEPER, OWNER, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import type { BoardDto } from "../../components/api/board";
import type { MaterialiseResult } from "../../components/api/standing";

const BOARD: BoardDto = {
  date: "2025-12-02",
  products: [
    { id: 101, name: "Milk-bread dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", total: 7 },
    { id: 102, name: "Brioche burger buns", saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns", total: 4 },
  ],
  rows: [
    { accountId: 12, accountName: "Juniper Table", orderId: 902, status: "locked", poNumber: "JT-9", quantities: { 101: 4, 102: 4 }, totalCents: 13600 },
    { accountId: 11, accountName: "Tidewater Café", orderId: 901, status: "open", poNumber: null, quantities: { 101: 3 }, totalCents: 4860 },
  ],
  totalCents: 18460,
  held: [],
};

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));

function routes(user: typeof OWNER) {
  return { ...sessionRoutes(user), "GET /api/orders/board": (req: { query: Record<string, string> }) => ({ body: { board: { ...BOARD, date: req.query.date } } }) };
}

describe("orders board", () => {
  it("shows totals per product and per order, one card per account on a phone", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER));
    renderApp("/office/orders");
    expect(await screen.findByTestId("board-total-101")).toHaveTextContent(/7.*Milk-bread dinner rolls.*trays of 15 rolls/);
    expect(screen.getByTestId("board-total-102")).toHaveTextContent(/4.*Brioche burger buns.*packs of 8 buns/);
    expect(screen.getByTestId("board-grand-total")).toHaveTextContent("2 orders · 2 products · $184.60"); // 7 trays and 4 packs are never added up
    expect(screen.getByTestId("board-row-902")).toHaveTextContent(/Juniper Table.*PO JT-9.*4.*Milk-bread dinner rolls.*\$136\.00/);
    expect(api.callsTo("GET", "/api/orders/board")[0].query.date).toBe("2025-12-02");
    expect(screen.getByTestId("board-csv")).toBeOnTheScreen();
    expect(screen.getByTestId("materialise")).toBeOnTheScreen();
  });

  it("lays the board out as a table with a totals row from 1024 px", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    mockApi(routes(OWNER));
    renderApp("/office/orders?date=2025-12-03");
    expect(await screen.findByTestId("board-table")).toBeOnTheScreen();
    expect(screen.getByTestId("board-total-row")).toHaveTextContent(/Total.*2 orders.*7.*4.*\$184\.60/);
    expect(screen.getByTestId("board-row-901")).toHaveTextContent(/Tidewater Café.*3.*–.*\$48\.60/);
    expect(screen.getByTestId("board-title")).toHaveTextContent("Wednesday, December 3");
  });

  it("switches dates", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER));
    renderApp("/office/orders");
    await screen.findByTestId("board-total-101");
    fireEvent.press(screen.getByTestId("board-next"));
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/orders/board" && c.query.date === "2025-12-03")).toBe(true));
    expect(await screen.findByTestId("board-date")).toHaveTextContent("Wed, Dec 3");
  });

  it("goes to any date typed or picked in the date field (issue 12, item 7)", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER));
    renderApp("/office/orders");
    await screen.findByTestId("board-total-101");
    fireEvent.changeText(screen.getByTestId("board-date-pick"), "2025-12-1");
    expect(api.calls.some((c) => c.path === "/api/orders/board" && c.query.date?.startsWith("2025-12-1"))).toBe(false); // not a whole date yet
    fireEvent.changeText(screen.getByTestId("board-date-pick"), "2025-12-19");
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/orders/board" && c.query.date === "2025-12-19")).toBe(true));
    expect(await screen.findByTestId("board-title")).toHaveTextContent("Friday, December 19");
  });

  it("says which accounts on hold are left off the date, and why (issue 12, item 7)", async () => {
    signedInAs(OWNER);
    mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/orders/board": (req: { query: Record<string, string> }) => ({
        body: { board: { ...BOARD, date: req.query.date, held: [{ accountId: 13, accountName: "North Pier Coffee", hold: "credit" }, { accountId: 14, accountName: "Quay Deli", hold: "paused" }] } },
      }),
    });
    renderApp("/office/orders");
    expect(await screen.findByTestId("board-held")).toBeOnTheScreen();
    expect(await screen.findByText(
      "North Pier Coffee is on credit hold (overdue invoices): its standing order is not made for this date unless they are paid before the cut-off. Quay Deli is paused by the bakery: its standing order is not made for this date until the account is started again.",
    )).toBeOnTheScreen();
  });

  it("makes standing orders now (owner) and reports what it did", async () => {
    signedInAs(OWNER);
    const api = mockApi({ ...routes(OWNER), "POST /api/standing-orders/materialise": { body: { result: { created: 3, updated: 1, cancelled: 0 } satisfies MaterialiseResult } } });
    renderApp("/office/orders");
    fireEvent.press(await screen.findByTestId("materialise"));
    expect(await screen.findByTestId("materialise-result")).toHaveTextContent(/3 new, 1 updated, 0 canceled/);
    expect(api.callsTo("POST", "/api/standing-orders/materialise")).toHaveLength(1);
  });

  it("is read-only for the bookkeeper", async () => {
    signedInAs(BOOKKEEPER);
    mockApi(routes(BOOKKEEPER));
    renderApp("/office/orders");
    expect(await screen.findByTestId("board-total-101")).toBeOnTheScreen();
    expect(screen.queryByTestId("materialise")).toBeNull();
  });

  it("gives the baker the totals without money or office buttons", async () => {
    signedInAs(BAKER);
    mockApi(routes(BAKER));
    renderApp("/bake/orders");
    expect(await screen.findByTestId("board-total-101")).toHaveTextContent(/7/);
    expect(screen.getByTestId("board-grand-total")).toHaveTextContent("2 orders · 2 products");
    expect(screen.queryByText(/\$184\.60/)).toBeNull();
    expect(screen.queryByTestId("board-csv")).toBeNull();
    expect(screen.queryByTestId("materialise")).toBeNull();
    expect(screen.getByTestId("tab-orders")).toBeOnTheScreen();
  });
});
