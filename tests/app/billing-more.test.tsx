import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, BUYER, OWNER, account, apiError, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import type { OutboxMailDto, ResendResultDto } from "../../components/api/outbox";
import type { CalendarFeedDto } from "../../shared/contracts/feed";
import type { TaxCertificateDto } from "../../components/api/accountBilling";
import type { BillingSettingsDto } from "../../components/api/billingSettings";

const MAILS: OutboxMailDto[] = [
  { id: 7, kind: "invoice", to: "accounts@northpier.test", subject: "Invoice HB-2025-00042 from Hollowbrook Bakehouse", status: "failed", attempts: 12, lastError: "connect ECONNREFUSED 127.0.0.1:1", nextAttemptAt: "2025-12-01T10:00:00.000Z", sentAt: null, createdAt: "2025-12-01T10:00:00.000Z", messageId: "<invoice.1@panwise>" },
  { id: 8, kind: "receipt", to: "accounts@tidewater.test", subject: "Receipt for HB-2025-00041", status: "sent", attempts: 1, lastError: null, nextAttemptAt: "2025-12-02T10:00:00.000Z", sentAt: "2025-12-02T10:00:00.000Z", createdAt: "2025-12-02T10:00:00.000Z", messageId: "<receipt.2@panwise>" },
];

const CERT = (o: Partial<TaxCertificateDto> = {}): TaxCertificateDto => ({ id: 3, status: "approved", expiresOn: "2025-11-30", expired: true, contentType: "application/pdf", sizeBytes: 48213, createdAt: "2024-12-01T10:00:00.000Z", ...o });

describe("outgoing e-mail (owner)", () => {
  it("shows statuses and the last error, and sends a failed mail again", async () => {
    signedInAs(OWNER);
    const api = mockApi({ ...sessionRoutes(OWNER), "GET /api/outbox": { body: { mails: MAILS } }, "POST /api/outbox/:id/resend": { status: 202, body: { queued: true } satisfies ResendResultDto } });
    renderApp("/office/money/outbox");
    expect(await screen.findByTestId("outbox-status-7")).toHaveTextContent("Failed");
    expect(screen.getByTestId("outbox-error-7")).toHaveTextContent("Last error: connect ECONNREFUSED 127.0.0.1:1");
    expect(screen.getByTestId("outbox-status-8")).toHaveTextContent("Sent");
    expect(screen.queryByTestId("outbox-resend-8")).toBeNull();
    fireEvent.press(screen.getByTestId("outbox-resend-7"));
    expect(await screen.findByTestId("outbox-resent")).toHaveTextContent(/is queued to go again/);
    expect(api.callsTo("POST", "/api/outbox/7/resend")).toHaveLength(1);
    fireEvent.press(screen.getByTestId("outbox-status-failed"));
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/outbox" && c.query.status === "failed")).toBe(true));
  });

  it("names every kind of mail in words, and an unknown kind as plain \"E-mail\", never its code", async () => {
    // Issue 10 "No raw codes reach a person": the outbox used to print "order_changed".
    signedInAs(OWNER);
    const base = MAILS[1];
    const mails: OutboxMailDto[] = [
      { ...base, id: 21, kind: "order_changed", subject: "Mail 21" },
      { ...base, id: 22, kind: "password_reset", subject: "Mail 22" },
      { ...base, id: 23, kind: "order_cancelled", subject: "Mail 23" },
      { ...base, id: 24, kind: "some_future_kind", subject: "Mail 24" },
    ];
    mockApi({ ...sessionRoutes(OWNER), "GET /api/outbox": { body: { mails } } });
    renderApp("/office/money/outbox");
    expect(await screen.findByTestId("outbox-row-21")).toHaveTextContent(/Order changed/);
    expect(screen.getByTestId("outbox-row-22")).toHaveTextContent(/Password reset/);
    expect(screen.getByTestId("outbox-row-23")).toHaveTextContent(/Order canceled/);
    expect(screen.getByTestId("outbox-row-24")).toHaveTextContent(/E-mail/);
    for (const id of [21, 22, 23, 24]) expect(screen.getByTestId(`outbox-row-${id}`)).not.toHaveTextContent(/[a-z]+_[a-z]+/);
  });

  it("lets the bookkeeper in, to the invoice and receipt mail, from a card on Money (issue 12, item 4)", async () => {
    signedInAs(BOOKKEEPER);
    const api = mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/outbox": { body: { mails: MAILS.filter((m) => m.kind === "invoice" || m.kind === "receipt") } } });
    const app = renderApp("/office/money");
    fireEvent.press(await screen.findByTestId("money-outbox"));
    expect(await screen.findByTestId("outbox-title")).toHaveTextContent("Outgoing e-mail");
    expect(screen.getByText(/The invoice and receipt e-mails sent to the accounts.*the owner's to see\./)).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/office/outbox");
    expect(api.callsTo("GET", "/api/outbox").length).toBeGreaterThan(0);
  });
});

describe("billing settings", () => {
  it("shows the tax rate as a percentage and saves it in basis points", async () => {
    signedInAs(OWNER);
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/settings/billing": { body: { settings: { salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14, paymentInstructions: "Transfer to account 0001.", remindersOn: false } satisfies BillingSettingsDto } },
      "PUT /api/settings/billing": (req) => ({ body: { settings: req.body } }),
    });
    renderApp("/office/money/settings");
    expect((await screen.findByTestId("settings-tax")).props.value).toBe("8.75");
    fireEvent.changeText(screen.getByTestId("settings-tax"), "8.255");
    fireEvent.changeText(screen.getByTestId("settings-prefix"), "h3");
    fireEvent.press(screen.getByTestId("settings-save"));
    expect(screen.getByTestId("settings-tax-error")).toHaveTextContent(/two decimals at most/);
    expect(screen.getByTestId("settings-prefix-error")).toHaveTextContent("1 to 6 capital letters, e.g. HB.");
    fireEvent.changeText(screen.getByTestId("settings-tax"), "9.5");
    fireEvent.changeText(screen.getByTestId("settings-prefix"), "hbk");
    fireEvent.press(screen.getByTestId("settings-save"));
    expect(await screen.findByTestId("billing-settings-saved")).toBeOnTheScreen();
    expect(api.callsTo("PUT", "/api/settings/billing")[0].body).toEqual({ salesTaxRateBp: 950, invoicePrefix: "HBK", creditHoldDays: 14, paymentInstructions: "Transfer to account 0001." });
  });

  it("is read-only for the bookkeeper", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/settings/billing": { body: { settings: { salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14, paymentInstructions: "", remindersOn: false } satisfies BillingSettingsDto } } });
    renderApp("/office/money/settings");
    expect(await screen.findByTestId("billing-settings-readonly")).toHaveTextContent(/8\.75 %.*HB.*14 days overdue/);
    expect(screen.queryByTestId("settings-save")).toBeNull();
  });
});

describe("exports", () => {
  it("offers the three CSV files, each with a line about it, and reports a failed download", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/reports/exports/:file": apiError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was charged; please try again in a minute.") });
    renderApp("/office/money/exports");
    expect(await screen.findByRole("button", { name: "Download invoices CSV" })).toBeOnTheScreen();
    expect(screen.getByRole("button", { name: "Download payments CSV" })).toBeOnTheScreen();
    expect(screen.getByTestId("export-payouts-card")).toHaveTextContent(/gross, fees, refunds, net/);
    fireEvent.press(screen.getByTestId("export-payouts"));
    expect(await screen.findByTestId("export-payouts-error")).toHaveTextContent(/not reachable right now/);
  });
});

describe("export date ranges (issue 12)", () => {
  it("sends the range with each download, and refuses an end before the start beside the field", async () => {
    signedInAs(BOOKKEEPER);
    const api = mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/reports/exports/:file": { body: "Number\n" } });
    renderApp("/office/money/exports");
    fireEvent.changeText(await screen.findByTestId("export-from"), "2025-11-01");
    fireEvent.changeText(screen.getByTestId("export-to"), "2025-10-31");
    expect(screen.getByTestId("export-to-error")).toHaveTextContent("The end date is before the start date.");
    expect(screen.getByTestId("export-invoices")).toBeDisabled();
    fireEvent.changeText(screen.getByTestId("export-to"), "2025-11-30");
    expect(screen.getByRole("button", { name: "Download invoices CSV (2025-11-01 to 2025-11-30)" })).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("export-invoices"));
    await waitFor(() => expect(api.callsTo("GET", "/api/reports/exports/invoices.csv")).toHaveLength(1));
    expect(api.callsTo("GET", "/api/reports/exports/invoices.csv")[0].query).toEqual({ from: "2025-11-01", to: "2025-11-30" });
  });
});

describe("tax-exemption certificates", () => {
  it("warns the buyer that an expired certificate means tax again", async () => {
    signedInAs(BUYER);
    mockApi({
      ...sessionRoutes(BUYER),
      "GET /api/accounts/:id": { body: { account: account() } },
      "GET /api/accounts/:id/delivery": { body: { delivery: { routeWeekdays: null, minimumOrderCents: 0, priceListId: null } } },
      "GET /api/accounts/:id/certificates": { body: { certificates: [CERT()] } },
      "GET /api/calendar-feed": { body: { url: null } satisfies CalendarFeedDto },
    });
    renderApp("/buyer/account");
    expect(await screen.findByTestId("cert-expired-warning")).toHaveTextContent(/expired on Nov 30, 2025: tax is charged again until a new one is approved/);
    expect(screen.getByTestId("cert-3-status")).toHaveTextContent("Expired");
    expect(screen.queryByTestId("cert-3-approve")).toBeNull();
    expect(screen.getByTestId("buyer-account-me")).toBeOnTheScreen();
  });

  it("lets the owner approve a pending certificate and change an account's terms", async () => {
    signedInAs(OWNER);
    let reviewed = false;
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts/:id": { body: { account: account() } },
      "GET /api/accounts/:id/delivery": { body: { delivery: { routeWeekdays: null, minimumOrderCents: 0, priceListId: null } } },
      "GET /api/price-lists": { body: { priceLists: [] } },
      "GET /api/invoices": { body: { invoices: [], totals: { count: 0, totalCents: 0, dueCents: 0, paidCents: 0 } } },
      "GET /api/accounts/:id/certificates": () => ({ body: { certificates: [CERT({ id: 4, status: reviewed ? "approved" : "pending", expiresOn: "2026-12-31", expired: false })] } }),
      "POST /api/certificates/:id/review": () => {
        reviewed = true;
        return { body: { certificate: { id: 4, status: "approved" } } };
      },
      "PUT /api/accounts/:id/terms": (req) => ({ body: req.body }),
    });
    renderApp("/office/accounts/11");
    fireEvent.press(await screen.findByTestId("cert-4-approve"));
    expect(await screen.findByTestId("cert-valid")).toHaveTextContent(/approved until Dec 31, 2026/);
    expect(api.callsTo("POST", "/api/certificates/4/review")[0].body).toEqual({ status: "approved" });

    fireEvent.press(screen.getByTestId("account-terms-choice-net14"));
    fireEvent.press(screen.getByTestId("account-terms-save"));
    expect(await screen.findByTestId("account-terms-saved")).toHaveTextContent(/Payment terms are now: Weekly statement, net 14\./);
    expect(api.callsTo("PUT", "/api/accounts/11/terms")[0].body).toEqual({ paymentTerms: "net14" });
  });
});
