import { Dimensions } from "react-native";
import { fireEvent, screen } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import type { AgingDto } from "../../components/api/reports";

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));

const AGING: AgingDto = {
  today: "2025-12-02",
  buckets: ["current", "1-30", "31-60", "61-90", "90+"],
  accounts: [
    { accountId: 13, accountName: "North Pier Coffee", onHold: true, creditHold: true, current: 0, "1-30": 4200, "31-60": 9150, "61-90": 0, "90+": 0, total: 13350 },
    { accountId: 12, accountName: "Juniper Table", onHold: false, creditHold: false, current: 6075, "1-30": 0, "31-60": 0, "61-90": 0, "90+": 1000, total: 7075 },
  ],
  totals: { current: 6075, "1-30": 4200, "31-60": 9150, "61-90": 0, "90+": 1000, total: 20425 },
};

describe("aging report", () => {
  it("shows each account's buckets with an on-hold badge and a totals row", async () => {
    setWidth(1280);
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/reports/aging": { body: { aging: AGING } } });
    const app = renderApp("/office/money/aging");
    expect(await screen.findByTestId("aging-table")).toBeOnTheScreen();
    expect(screen.getByTestId("aging-row-13")).toHaveTextContent(/North Pier Coffee.*Credit hold.*–.*\$42\.00.*\$91\.50.*–.*–.*\$133\.50/);
    expect(screen.getByTestId("aging-hold-13")).toBeOnTheScreen();
    expect(screen.queryByTestId("aging-hold-12")).toBeNull();
    expect(screen.getByTestId("aging-totals")).toHaveTextContent(/Total.*\$60\.75.*\$42\.00.*\$91\.50.*\$0\.00.*\$10\.00.*\$204\.25/);
    expect(screen.getByTestId("aging-total-total")).toHaveTextContent("$204.25");
    expect(screen.getByTestId("aging-title")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("aging-row-13"));
    expect(await screen.findByTestId("invoices-screen")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/office/invoices");
  });

  it("shows bucket totals as tiles on a phone", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/reports/aging": { body: { aging: AGING } } });
    renderApp("/office/money/aging");
    expect(await screen.findByTestId("aging-total-31-60")).toHaveTextContent(/31–60 days.*\$91\.50/);
    expect(screen.getByTestId("aging-total-total")).toHaveTextContent(/Total owed.*\$204\.25/);
    expect(screen.getByTestId("aging-row-13")).toHaveTextContent(/North Pier Coffee.*Credit hold.*1–30 days.*\$42\.00.*31–60 days.*\$91\.50.*Total.*\$133\.50/);
  });

  it("says when nothing is owed", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/reports/aging": { body: { aging: { ...AGING, accounts: [], totals: { current: 0, "1-30": 0, "31-60": 0, "61-90": 0, "90+": 0, total: 0 } } } } });
    renderApp("/office/money/aging");
    expect(await screen.findByTestId("aging-empty")).toHaveTextContent(/Nothing is owed/);
  });

  it("reaches the report from the Money hub", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/reports/aging": { body: { aging: AGING } } });
    renderApp("/office/money");
    expect(await screen.findByTestId("money-payouts")).toBeOnTheScreen();
    expect(screen.getByTestId("money-exports")).toBeOnTheScreen();
    // The bookkeeper's outgoing mail (invoices and receipts) is on Money too (issue 12, item 4).
    expect(screen.getByTestId("money-outbox")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("money-aging"));
    expect(await screen.findByTestId("aging-row-13")).toBeOnTheScreen();
  });
});
