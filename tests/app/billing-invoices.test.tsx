import { Dimensions, Linking } from "react-native";
import { act, fireEvent, screen, waitFor, within } from "expo-router/testing-library";
import { BOOKKEEPER, BUYER, OWNER, account, apiError, mockApi, renderApp, sessionRoutes, signedInAs, waitForGone, type FakeRequest } from "./helpers";
import { invoiceDetail, invoiceDto } from "./billing-fixtures";
import type { InvoiceListDto, InvoiceTotalsDto } from "../../components/api/invoices";

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));

const INVOICES = [
  invoiceDto(),
  invoiceDto({ id: 42, number: "HB-2025-00042", accountId: 12, accountName: "North Pier Coffee", kind: "statement", dueDate: "2025-11-20", overdue: true, totalCents: 12000, amountDueCents: 12000, periodStart: "2025-11-10", periodEnd: "2025-11-16" }),
  invoiceDto({ id: 43, number: "HB-2025-00043", status: "paid", paidCents: 5873, amountDueCents: 0 }),
];
const TOTALS = { count: 3, totalCents: 23746, dueCents: 17873, paidCents: 5873 } satisfies InvoiceTotalsDto;

function listRoute(req: FakeRequest) {
  // The server filters; the fake only needs to answer something that follows the filter.
  let rows = INVOICES;
  if (req.query.overdue) rows = rows.filter((i) => i.overdue);
  if (req.query.status) rows = rows.filter((i) => i.status === req.query.status);
  if (req.query.accountId) rows = rows.filter((i) => String(i.accountId) === req.query.accountId);
  if (req.query.q) rows = rows.filter((i) => i.number.includes(req.query.q) || i.accountName.includes(req.query.q));
  const totals = rows === INVOICES ? TOTALS : { count: rows.length, totalCents: rows.reduce((s, r) => s + r.totalCents, 0), dueCents: rows.reduce((s, r) => s + r.amountDueCents, 0), paidCents: rows.reduce((s, r) => s + r.paidCents, 0) };
  return { body: { invoices: rows, totals } satisfies InvoiceListDto };
}

const officeRoutes = (user: typeof OWNER) => ({
  ...sessionRoutes(user),
  "GET /api/invoices": listRoute,
  "GET /api/accounts": { body: { accounts: [account(), account({ id: 12, businessName: "North Pier Coffee", status: "on_hold" })] } },
});

describe("invoices table", () => {
  it("shows a table with a totals row from 1024 px and sends each filter to the server", async () => {
    setWidth(1280);
    signedInAs(BOOKKEEPER);
    const api = mockApi(officeRoutes(BOOKKEEPER));
    renderApp("/office/invoices");
    const table = await screen.findByTestId("invoices-table");
    expect(within(table).getByTestId("invoice-row-42")).toHaveTextContent(/HB-2025-00042.*Statement.*North Pier Coffee.*Overdue.*\$120\.00/);
    expect(screen.getByTestId("invoices-totals")).toHaveTextContent(/3 invoices.*\$237\.46.*\$58\.73.*\$178\.73/);
    expect(screen.getByTestId("invoices-total-due")).toHaveTextContent(/\$178\.73$/);
    expect(screen.getByTestId("nav-invoices")).toBeOnTheScreen();
    expect(api.callsTo("GET", "/api/invoices")[0].query).toEqual({ sort: "newest" });

    fireEvent.press(screen.getByTestId("invoices-status-overdue"));
    await waitForGone("invoice-row-41");
    expect(api.callsTo("GET", "/api/invoices").at(-1)!.query).toEqual({ overdue: "1", sort: "newest" });
    expect(screen.getByTestId("invoices-totals")).toHaveTextContent(/1 invoice.*\$120\.00.*\$0\.00.*\$120\.00/);

    fireEvent.press(screen.getByTestId("invoices-status-all"));
    fireEvent.press(await screen.findByTestId("invoices-account-12"));
    fireEvent.press(screen.getByTestId("invoices-sort-due"));
    fireEvent.changeText(screen.getByTestId("invoices-from"), "2025-11-01");
    fireEvent.changeText(screen.getByTestId("invoices-to"), "2025-12-31");
    fireEvent.changeText(screen.getByTestId("invoices-search"), "North");
    await act(async () => {
      jest.advanceTimersByTime(400);
    });
    await waitFor(() => expect(api.callsTo("GET", "/api/invoices").at(-1)!.query).toEqual({ accountId: "12", sort: "due", from: "2025-11-01", to: "2025-12-31", q: "North" }));
    await waitForGone("invoice-row-41");
    expect(screen.getByTestId("invoice-row-42")).toBeOnTheScreen();
  });

  it("checks the dates before filtering by them", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    const api = mockApi(officeRoutes(OWNER));
    renderApp("/office/invoices");
    await screen.findByTestId("invoices-table");
    fireEvent.changeText(screen.getByTestId("invoices-from"), "2025-13-01");
    await act(async () => {
      jest.advanceTimersByTime(400);
    });
    expect(await screen.findByTestId("invoices-from-error")).toHaveTextContent("Write the date as YYYY-MM-DD.");
    expect(api.calls.filter((c) => c.path === "/api/invoices" && c.query.from)).toHaveLength(0);
  });

  it("starts filtered to an account from its page, and lists cards with totals on a phone", async () => {
    signedInAs(OWNER);
    const api = mockApi(officeRoutes(OWNER));
    renderApp("/office/invoices?accountId=12");
    expect(await screen.findByTestId("invoice-row-42")).toHaveTextContent(/HB-2025-00042.*Overdue.*North Pier Coffee.*\$120\.00 owed of \$120\.00/);
    expect(screen.getByTestId("invoices-total-count")).toHaveTextContent(/Invoices\s*1$/);
    expect(screen.getByTestId("invoices-total-due")).toHaveTextContent(/\$120\.00$/);
    expect(api.callsTo("GET", "/api/invoices")[0].query.accountId).toBe("12");
    expect(screen.getByTestId("tab-invoices")).toBeOnTheScreen();
  });

  it("shows the empty and error states", async () => {
    signedInAs(BOOKKEEPER);
    let fail = true;
    mockApi({ ...officeRoutes(BOOKKEEPER), "GET /api/invoices": () => (fail ? apiError(500, "internal_error", "The database is resting.") : { body: { invoices: [], totals: { count: 0, totalCents: 0, dueCents: 0, paidCents: 0 } } }) });
    renderApp("/office/invoices");
    expect(await screen.findByTestId("invoices-error")).toHaveTextContent(/The database is resting/);
    fail = false;
    fireEvent.press(screen.getByTestId("invoices-error-retry"));
    expect(await screen.findByTestId("invoices-empty")).toHaveTextContent(/No invoices yet/);
  });

  it("issues statements now and says which", async () => {
    signedInAs(OWNER);
    const api = mockApi({ ...officeRoutes(OWNER), "POST /api/invoices/statements": { body: { issued: ["HB-2025-00050", "HB-2025-00051"] } } });
    renderApp("/office/invoices");
    fireEvent.press(await screen.findByTestId("issue-statements"));
    expect(await screen.findByTestId("statements-result")).toHaveTextContent(/Issued and e-mailed 2 statements: HB-2025-00050, HB-2025-00051\.$/);
    expect(api.callsTo("POST", "/api/invoices/statements")[0].body).toEqual({});
  });

  it("gives the buyer their own list with an Invoices tab", async () => {
    signedInAs(BUYER);
    mockApi({ ...sessionRoutes(BUYER), "GET /api/invoices": { body: { invoices: [INVOICES[0]], totals: { count: 1, totalCents: 5873, dueCents: 5873, paidCents: 0 } } } });
    const app = renderApp("/buyer/invoices");
    expect(await screen.findByTestId("invoice-row-41")).toHaveTextContent(/HB-2025-00041.*Open.*\$58\.73 owed/);
    expect(screen.queryByTestId("issue-statements")).toBeNull();
    expect(screen.getByTestId("tab-invoices")).toBeOnTheScreen();
    expect(screen.getByTestId("tab-account")).toBeOnTheScreen();
    expect(screen.queryByTestId("tab-more")).toBeNull();
    fireEvent.press(screen.getByTestId("invoice-row-41"));
    await waitFor(() => expect(app.getPathname()).toBe("/buyer/invoices/41"));
  });
});

describe("invoice detail", () => {
  const detailRoutes = (user: typeof OWNER, detail = invoiceDetail({ overdue: true })) => ({
    ...sessionRoutes(user),
    "GET /api/invoices/:id": (_req: FakeRequest, p: Record<string, string>) => (p.id === "41" ? { body: detail } : apiError(404, "not_found", "That invoice was not found.")),
  });

  it("shows lines, tax, totals and when it was e-mailed", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    mockApi(detailRoutes(OWNER));
    renderApp("/office/invoices/41");
    expect(await screen.findByTestId("invoice-title")).toHaveTextContent("HB-2025-00041");
    expect(screen.getByTestId("invoice-line-301")).toHaveTextContent(/Dec 1, 2025.*Milk-bread dinner rolls.*3.*\$18\.00.*\$54\.00/);
    expect(screen.getByTestId("invoice-tax")).toHaveTextContent(/Sales tax \(8\.75 %\).*\$4\.73/);
    expect(screen.getByTestId("invoice-total")).toHaveTextContent(/^Total\s*\$58\.73$/);
    expect(screen.getByTestId("invoice-amount-due")).toHaveTextContent("$58.73");
    expect(screen.getByTestId("invoice-status")).toHaveTextContent("Overdue");
    expect(screen.getByTestId("invoice-sent")).toHaveTextContent(/To the billing e-mail, Dec 1, 2025/);
    expect(screen.getByTestId("invoice-no-payments")).toBeOnTheScreen();
    expect(screen.getByTestId("invoice-pdf")).toBeOnTheScreen();
  });

  it("lists the invoice's e-mails with where each one is", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    const withMail = { ...invoiceDetail({ overdue: true }), emails: [{ id: 7, kind: "invoice", to: "accounts@tidewater.test", subject: "Invoice HB-2025-00041", status: "failed" as const, sentAt: null, createdAt: "2025-12-01T18:00:00.000Z" }] };
    mockApi({ ...sessionRoutes(OWNER), "GET /api/invoices/:id": () => ({ body: withMail }) });
    renderApp("/office/invoices/41");
    expect(await screen.findByTestId("invoice-email-7")).toHaveTextContent(/Invoice with PDF.*To accounts@tidewater\.test · Failed/);
  });

  it("checks the payment form, shows the server's field error next to the amount, then records it", async () => {
    signedInAs(BOOKKEEPER);
    let calls = 0;
    const api = mockApi({
      ...detailRoutes(BOOKKEEPER),
      "POST /api/invoices/:id/payments": (req) => {
        calls += 1;
        if (calls === 1) return apiError(400, "validation_error", "That is more than the 58.73 still owed.", { amountCents: "At most 58.73." });
        const b = req.body as { amountCents: number; method: string; reference: string; receivedOn: string };
        return { status: 201, body: { payment: { id: 80, ...b, stripePaymentIntentId: null, stripeChargeId: null } } };
      },
    });
    renderApp("/office/invoices/41");
    fireEvent.press(await screen.findByTestId("record-payment-open"));
    // Filled in with what is owed and today's date.
    expect(screen.getByTestId("payment-amount").props.value).toBe("58.73");
    expect(screen.getByTestId("payment-received-on").props.value).toBe("2025-12-02");

    fireEvent.changeText(screen.getByTestId("payment-amount"), "12,5x");
    fireEvent.changeText(screen.getByTestId("payment-received-on"), "2025-02-30");
    fireEvent.press(screen.getByTestId("payment-submit"));
    expect(screen.getByTestId("payment-amount-error")).toHaveTextContent("Enter an amount like 12.50.");
    expect(screen.getByTestId("payment-method-error")).toHaveTextContent("Choose how it was paid.");
    expect(screen.getByTestId("payment-reference-error")).toHaveTextContent("Enter the transfer reference or check number.");
    expect(screen.getByTestId("payment-received-on-error")).toHaveTextContent("Write the date as YYYY-MM-DD.");

    fireEvent.changeText(screen.getByTestId("payment-amount"), "60.00");
    fireEvent.press(screen.getByTestId("payment-submit"));
    expect(screen.getByTestId("payment-amount-error")).toHaveTextContent("At most $58.73, what is still owed.");
    expect(api.callsTo("POST", "/api/invoices/41/payments")).toHaveLength(0);

    fireEvent.changeText(screen.getByTestId("payment-amount"), "58.73");
    fireEvent.press(screen.getByTestId("payment-method-bank_transfer"));
    fireEvent.changeText(screen.getByTestId("payment-reference"), "BT-0041");
    fireEvent.changeText(screen.getByTestId("payment-received-on"), "2025-12-02");
    fireEvent.press(screen.getByTestId("payment-submit"));
    expect(await screen.findByTestId("payment-amount-error")).toHaveTextContent("At most 58.73.");
    expect(screen.queryByTestId("payment-error")).toBeNull();

    fireEvent.press(screen.getByTestId("payment-submit"));
    expect(await screen.findByTestId("payment-saved")).toHaveTextContent(/Bank transfer of \$58\.73 recorded\.$/);
    expect(api.callsTo("POST", "/api/invoices/41/payments")[1].body).toEqual({ amountCents: 5873, method: "bank_transfer", reference: "BT-0041", receivedOn: "2025-12-02" });
    // The invoice is read again.
    await waitFor(() => expect(api.callsTo("GET", "/api/invoices/41").length).toBeGreaterThan(1));
  });

  it("issues a credit note from an invoice line", async () => {
    signedInAs(OWNER);
    const api = mockApi({ ...detailRoutes(OWNER), "POST /api/invoices/:id/credit-notes": { status: 201, body: { creditNote: { id: 5, number: "HB-CN-2025-00005", totalCents: 1958, disposition: "applied" } } } });
    renderApp("/office/invoices/41");
    fireEvent.press(await screen.findByTestId("credit-note-open"));
    fireEvent.press(screen.getByTestId("credit-submit"));
    expect(screen.getByTestId("credit-reason-error")).toHaveTextContent(/Say why/);
    expect(screen.getByTestId("credit-lines-error")).toHaveTextContent("Add what is credited.");
    fireEvent.changeText(screen.getByTestId("credit-reason"), "One tray crushed");
    fireEvent.press(screen.getByTestId("credit-from-line-301"));
    expect(screen.getByTestId("credit-preview")).toHaveTextContent("Credit with tax: $19.58 (tax 8.75 %)");
    fireEvent.press(screen.getByTestId("credit-submit"));
    expect(await screen.findByTestId("credit-note-done")).toHaveTextContent(/Credit note HB-CN-2025-00005 for \$19\.58: taken off this invoice\.$/);
    expect(api.callsTo("POST", "/api/invoices/41/credit-notes")[0].body).toEqual({ reason: "One tray crushed", lines: [{ description: "Milk-bread dinner rolls (tray of 15 rolls)", quantity: 1, unitPriceCents: 1800 }] });
  });

  it("lets the buyer pay by card: goes to the hosted page, or says card payments are down", async () => {
    signedInAs(BUYER);
    const open = jest.spyOn(Linking, "openURL").mockResolvedValue(true);
    let down = true;
    const api = mockApi({
      ...detailRoutes(BUYER, invoiceDetail()),
      "POST /api/invoices/:id/checkout": () => (down ? apiError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was charged; please try again in a minute.") : { status: 201, body: { url: "http://127.0.0.1:12111/pay/cs_test_1" } }),
    });
    renderApp("/buyer/invoices/41");
    expect(await screen.findByTestId("invoice-amount-due")).toHaveTextContent("$58.73");
    expect(screen.queryByTestId("record-payment-card")).toBeNull();
    expect(screen.queryByTestId("credit-note-card")).toBeNull();
    fireEvent.press(screen.getByRole("button", { name: "Pay by card" }));
    expect(await screen.findByTestId("pay-by-card-error")).toHaveTextContent(/Card payments are not reachable right now/);
    expect(screen.getByTestId("pay-by-card")).toHaveTextContent(/Try again$/);
    down = false;
    fireEvent.press(screen.getByTestId("pay-by-card"));
    await waitFor(() => expect(open).toHaveBeenCalledWith("http://127.0.0.1:12111/pay/cs_test_1"));
    expect(api.callsTo("POST", "/api/invoices/41/checkout")).toHaveLength(2);
    open.mockRestore();
  });

  it("flags an invoice paid twice and refunds the extra to the card in one action; shows rejected payment notices", async () => {
    setWidth(1280);
    signedInAs(BOOKKEEPER);
    const overpaid = invoiceDetail(
      { status: "paid", paidCents: 2 * 5873, amountDueCents: 0, overpaidCents: 5873 },
      {
        payments: [
          { id: 71, method: "bank_transfer", amountCents: 5873, reference: "BT-1", receivedOn: "2025-12-02", stripePaymentIntentId: null, stripeChargeId: null },
          { id: 72, method: "card", amountCents: 5873, reference: "cs_test_1", receivedOn: "2025-12-02", stripePaymentIntentId: "pi_1", stripeChargeId: "ch_1" },
        ],
        alerts: [
          { kind: "overpayment", amountCents: 5873, eventId: null, at: null, message: "This invoice was paid more than it owes: 58.73 USD came in after it was settled. Refund it to the card." },
          { kind: "rejected_event", amountCents: null, eventId: "evt_forged", at: "2025-12-02T10:00:00.000Z", message: "A payment notice from Stripe (payment_intent.succeeded) was rejected and not applied: Payment intent pi_x was not paid through a checkout session Panwise created." },
        ],
      },
    );
    const refunded = invoiceDetail({ status: "paid", paidCents: 2 * 5873, refundedCents: 5873, amountDueCents: 0, overpaidCents: 0 }, { payments: overpaid.payments, refunds: [{ id: 9, stripeRefundId: "re_1", amountCents: 5873, overpayment: true, createdAt: "2025-12-02T11:00:00.000Z" }], alerts: [] });
    let done = false;
    const api = mockApi({
      ...sessionRoutes(BOOKKEEPER),
      "GET /api/invoices/:id": () => ({ body: done ? refunded : overpaid }),
      "POST /api/invoices/:id/overpayment-refund": () => {
        done = true;
        return { status: 201, body: { refund: { stripeRefundId: "re_1", amountCents: 5873, refunds: [{ stripeRefundId: "re_1", amountCents: 5873 }] } } };
      },
    });
    renderApp("/office/invoices/41");
    expect(await screen.findByTestId("invoice-alert-overpayment")).toHaveTextContent(/Paid twice: \$58\.73 too much.*Overpaid.*came in after it was settled/);
    expect(screen.getByTestId("invoice-alert-rejected_event")).toHaveTextContent(/Payment notice rejected.*Not applied.*was rejected and not applied/);
    fireEvent.press(screen.getByTestId("refund-overpayment"));
    expect(await screen.findByTestId("refund-overpayment-done")).toHaveTextContent(/Refunded \$58\.73 to the card\.$/);
    expect(api.callsTo("POST", "/api/invoices/41/overpayment-refund")).toHaveLength(1);
    // Read again: the flag is gone and the refund is listed as an overpayment given back.
    await waitForGone("invoice-alerts");
    expect(screen.getByTestId("refund-9")).toHaveTextContent(/\$58\.73.*overpayment given back · re_1/);
  });

  it("says when the refund of an overpayment fails, and the list flags overpaid invoices", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    const overpaid = invoiceDetail({ status: "paid", paidCents: 2 * 5873, amountDueCents: 0, overpaidCents: 5873 }, { alerts: [{ kind: "overpayment", amountCents: 5873, eventId: null, at: null, message: "This invoice was paid more than it owes." }] });
    mockApi({
      ...officeRoutes(OWNER),
      "GET /api/invoices": { body: { invoices: [invoiceDto({ status: "paid", paidCents: 11746, amountDueCents: 0, overpaidCents: 5873 })], totals: { count: 1, totalCents: 5873, dueCents: 0, paidCents: 11746, overpaidCount: 1 } } },
      "GET /api/invoices/:id": { body: overpaid },
      "POST /api/invoices/:id/overpayment-refund": apiError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was refunded; please try again in a minute."),
    });
    const app = renderApp("/office/invoices");
    expect(await screen.findByTestId("invoices-overpaid")).toHaveTextContent(/1 invoice was paid more than it owes\. Open it to refund the extra to the card\.$/);
    expect(screen.getByTestId("invoice-overpaid-41")).toHaveTextContent(/^Overpaid \$58\.73$/);
    fireEvent.press(screen.getByTestId("invoice-row-41"));
    await waitFor(() => expect(app.getPathname()).toBe("/office/invoices/41"));
    fireEvent.press(await screen.findByTestId("refund-overpayment"));
    expect(await screen.findByTestId("refund-overpayment-error")).toHaveTextContent(/Nothing was refunded/);
  });

  it("tells the buyer who paid twice that the extra goes back to the card, without the office's actions", async () => {
    signedInAs(BUYER);
    mockApi({ ...detailRoutes(BUYER, invoiceDetail({ status: "paid", paidCents: 11746, amountDueCents: 0, overpaidCents: 5873 }, { alerts: [{ kind: "overpayment", amountCents: 5873, eventId: null, at: null, message: "…" }] })) });
    renderApp("/buyer/invoices/41");
    expect(await screen.findByTestId("invoice-overpaid-note")).toHaveTextContent(/You paid \$58\.73 more than this invoice\. The bakery refunds it to your card\.$/);
    expect(screen.queryByTestId("refund-overpayment")).toBeNull();
  });

  it("says so when the invoice is not the buyer's", async () => {
    signedInAs(BUYER);
    mockApi(detailRoutes(BUYER));
    renderApp("/buyer/invoices/99");
    expect(await screen.findByTestId("invoice-not-found")).toBeOnTheScreen();
  });
});
