import { Dimensions } from "react-native";
import { fireEvent, screen, within } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest } from "./helpers";
import { payoutDetail } from "./billing-fixtures";
import type { PayoutDto } from "../../components/api/payouts";

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));

const PAYOUTS: PayoutDto[] = [
  { id: "po_fake_1", amountCents: 11058, currency: "usd", status: "paid", arrivalDate: "2025-12-04", created: "2025-12-02T10:00:00.000Z", reconciledAt: null, reconciledById: null },
  { id: "po_fake_0", amountCents: 5385, currency: "usd", status: "paid", arrivalDate: "2025-11-27", created: "2025-11-25T10:00:00.000Z", reconciledAt: "2025-11-28T15:00:00.000Z", reconciledById: 1 },
];

describe("payouts", () => {
  it("lists payouts with whether each is reconciled, and opens one", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/payouts": { body: { payouts: PAYOUTS } }, "GET /api/payouts/:id": { body: payoutDetail() } });
    const app = renderApp("/office/money/payouts");
    expect(await screen.findByTestId("payout-row-po_fake_1")).toHaveTextContent(/\$110\.58.*To reconcile.*Dec 4, 2025/);
    expect(screen.getByTestId("payout-reconciled-po_fake_0")).toHaveTextContent(/Reconciled/);
    fireEvent.press(screen.getByTestId("payout-row-po_fake_1"));
    expect(await screen.findByTestId("payout-title")).toHaveTextContent("$110.58");
    expect(app.getPathname()).toBe("/office/money/payouts/po_fake_1");
  });

  it("says so when the card processor can't be reached", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/payouts": apiError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was charged; please try again in a minute.") });
    renderApp("/office/money/payouts");
    expect(await screen.findByTestId("payouts-error")).toHaveTextContent(/The card processor can't be reached.*not reachable right now/);
    expect(screen.getByTestId("payouts-error-retry")).toBeOnTheScreen();
  });

  it("flags the unmatched transaction in red and reconciles anyway with a note", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": { body: { users: [] } },
      "GET /api/payouts/:id": { body: payoutDetail() },
      "POST /api/payouts/:id/reconcile": (req: FakeRequest) =>
        (req.body as { force?: boolean }).force
          ? { body: payoutDetail({ reconciled: { at: "2025-12-02T16:00:00.000Z", byId: OWNER.id, note: "Stray charge refunded by the bank" } }) }
          : apiError(409, "payout_unmatched", "1 transaction(s) do not match. Check them, or mark it reconciled anyway with a note."),
    });
    renderApp("/office/money/payouts/po_fake_1");
    expect(await screen.findByTestId("payout-gross")).toHaveTextContent(/\$117\.46/);
    expect(screen.getByTestId("payout-fees")).toHaveTextContent(/-\$6\.88/);
    expect(screen.getByTestId("payout-net")).toHaveTextContent(/\$110\.58/);
    expect(screen.getByTestId("payout-unmatched")).toHaveTextContent(/1 transaction doesn't match/);
    const stray = screen.getByTestId("txn-txn_2");
    expect(within(stray).getByTestId("txn-problem-txn_2")).toHaveTextContent("No Panwise payment or refund for this transaction.");
    // Each row leads with the invoice and its account, the date and the amount received; the fee and what was paid
    // out are lines of their own; the processor's id comes last, as a reference.
    const row = screen.getByTestId("txn-txn_1");
    expect(row).toHaveTextContent(/^Invoice HB-2025-00041.*Matched.*Tidewater Café.*Card payment · Dec 1, 2025.*Card payment reference pi_1.*Received\$58\.73.*Processor fee-\$2\.00.*Paid out\$56\.73$/);
    expect(within(row).getByTestId("txn-invoice-txn_1")).toHaveTextContent("Invoice HB-2025-00041");
    expect(within(row).getByTestId("txn-account-txn_1")).toHaveTextContent("Tidewater Café");
    expect(within(row).getByTestId("txn-fee-txn_1")).toHaveTextContent("Processor fee-$2.00");
    expect(within(row).getByTestId("txn-ref-txn_1")).toHaveTextContent("Card payment reference pi_1");
    expect(screen.queryByTestId("txn-problem-txn_1")).toBeNull();
    expect(stray).toHaveTextContent(/^No invoice found.*Card payment · Dec 2, 2025.*No Panwise payment.*Card payment reference ch_stray.*Received\$58\.73.*Processor fee-\$4\.88.*Paid out\$53\.85$/);
    expect(screen.getByText(/Arrived Dec 4, 2025 · Bank reference po_fake_1/)).toBeOnTheScreen();

    fireEvent.press(screen.getByTestId("reconcile"));
    expect(await screen.findByTestId("reconcile-refused")).toHaveTextContent(/do not match/);
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/reconcile")[0].body).toEqual({ note: "" });
    fireEvent.press(screen.getByRole("button", { name: "Mark reconciled anyway" }));
    expect(screen.getByTestId("reconcile-note-error")).toHaveTextContent(/Say why/);
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/reconcile")).toHaveLength(1);
    fireEvent.changeText(screen.getByTestId("reconcile-note"), "Stray charge refunded by the bank");
    fireEvent.press(screen.getByTestId("reconcile-force"));
    expect(await screen.findByTestId("payout-reconciled-by")).toHaveTextContent(/Marked reconciled by you \(Rosalind Hart\) on Dec 2, 2025/);
    expect(screen.getByTestId("payout-reconciled-note")).toHaveTextContent("Note: Stray charge refunded by the bank");
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/reconcile")[1].body).toEqual({ note: "Stray charge refunded by the bank", force: true });
  });

  it("reconciles a clean payout in one step", async () => {
    signedInAs(BOOKKEEPER);
    const clean = payoutDetail({ transactions: payoutDetail().transactions.slice(0, 1), unmatched: 0, grossCents: 5873, feesCents: 200, netCents: 5673, payout: { id: "po_fake_1", amountCents: 5673, currency: "usd", status: "paid", arrivalDate: "2025-12-04" } });
    const api = mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/payouts/:id": { body: clean }, "POST /api/payouts/:id/reconcile": { body: { ...clean, reconciled: { at: "2025-12-02T16:00:00.000Z", byId: 1, note: "" } } } });
    renderApp("/office/money/payouts/po_fake_1");
    expect(await screen.findByTestId("payout-net-ok")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("reconcile"));
    expect(await screen.findByTestId("payout-reconciled-by")).toHaveTextContent(/Marked reconciled by another office user/);
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/reconcile")[0].body).toEqual({ note: "" });
    expect(api.callsTo("GET", "/api/users")).toHaveLength(0);
  });

  it("undoes a reconciliation with a reason, and shows the history (issue 12)", async () => {
    signedInAs(BOOKKEEPER);
    const done = payoutDetail({ reconciled: { at: "2025-12-02T16:00:00.000Z", byId: 1, note: "Bank line 14" }, history: [{ action: "reconciled", at: "2025-12-02T16:00:00.000Z", byId: 1, byName: "Rosalind Hart", note: "Bank line 14" }] });
    const undone = { ...done, reconciled: null, history: [...done.history, { action: "undone" as const, at: "2025-12-03T09:00:00.000Z", byId: 3, byName: "Bo Books", note: "Wrong bank line" }] };
    const api = mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/payouts/:id": { body: done }, "POST /api/payouts/:id/undo-reconcile": { body: undone } });
    renderApp("/office/money/payouts/po_fake_1");
    expect(await screen.findByTestId("reconcile-history-0")).toHaveTextContent(/reconciled by Rosalind Hart — Bank line 14/);
    fireEvent.press(screen.getByTestId("reconcile-undo"));
    fireEvent.press(screen.getByTestId("reconcile-undo-confirm"));
    expect(await screen.findByText("Say why the reconciliation is undone (at least 3 characters).")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/undo-reconcile")).toHaveLength(0);
    fireEvent.changeText(screen.getByTestId("reconcile-undo-reason"), "Wrong bank line");
    fireEvent.press(screen.getByTestId("reconcile-undo-confirm"));
    expect(await screen.findByTestId("payout-reconcile-card")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/payouts/po_fake_1/undo-reconcile")[0].body).toEqual({ reason: "Wrong bank line" });
    expect(screen.getByTestId("reconcile-history-1")).toHaveTextContent(/undone by Bo Books — Wrong bank line/);
  });
});
