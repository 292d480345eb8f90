/**
 * The billing contract couples the server to the client: every check below is made by the type checker
 * (`npx tsc --noEmit`, the first stage of `npm test`), so a field renamed on the server and not on the client,
 * or the other way round, fails the build before any test runs. The runtime tests then hold the wire shapes and
 * the request schemas to what the screens send and the fixtures of tests/app claim.
 */
import { invoiceDto, type getInvoiceFor, type issueStatementsByHand, type listInvoices } from "../../server/billing/invoices.service";
import type { confirmDispatch } from "../../server/billing/dispatch.service";
import type { createCheckout } from "../../server/billing/checkout.service";
import type { recordManualPaymentAndExpire, refundOverpayment } from "../../server/billing/payments.service";
import type { issueCreditNote } from "../../server/billing/credit-notes.service";
import type { listPayouts, payoutDetail, reconcilePayout, undoReconcile } from "../../server/billing/payouts.service";
import type { aging } from "../../server/billing/reports.service";
import type { remindAllOverdue, remindInvoice } from "../../server/billing/reminders.service";
import type { getBillingSettings, saveBillingSettings, setPaymentTerms } from "../../server/billing/billing-settings.service";
import type { listCertificatesFor, reviewCertificate, uploadCertificate } from "../../server/billing/certificates.service";
import type { InvoiceDto, invoicesApi } from "../../components/api/invoices";
import type { payoutsApi } from "../../components/api/payouts";
import type { reportsApi } from "../../components/api/reports";
import type { billingSettingsApi } from "../../components/api/billingSettings";
import type { accountBillingApi } from "../../components/api/accountBilling";
import type { dispatchApi } from "../../components/api/dispatch";
import type { Invoice } from "../../server/billing/invoice.entity";
import { invoiceDetail as detailFixture, invoiceDto as invoiceFixture, payoutDetail as payoutFixture } from "../app/billing-fixtures";
import { billingSettingsSchema, creditNoteSchema, dispatchConfirmSchema, invoiceListQuerySchema, manualPaymentSchema, reconcileSchema, type CreditNoteInput, type PaymentInput } from "../../shared/schemas/billing";

/** Exactly the same type (not merely assignable either way). */
type Equal<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
/** A value of A can be used where B is expected. */
type Assignable<A, B> = [A] extends [B] ? true : false;
const holds = <T extends true>(): T => true as T;

type Answer<F extends (...args: never[]) => unknown> = Awaited<ReturnType<F>>;

/** What each server function answers is what the client's call for that route reads. */
export const coupling = [
  holds<Equal<Answer<typeof listInvoices>, Answer<typeof invoicesApi.list>>>(),
  holds<Equal<Answer<typeof getInvoiceFor>, Answer<typeof invoicesApi.get>>>(),
  holds<Equal<Answer<typeof createCheckout>, Answer<typeof invoicesApi.checkout>>>(),
  holds<Equal<Answer<typeof recordManualPaymentAndExpire>, Answer<typeof invoicesApi.recordPayment>>>(),
  holds<Equal<Answer<typeof issueCreditNote>, Answer<typeof invoicesApi.creditNote>>>(),
  holds<Equal<Answer<typeof refundOverpayment>, Answer<typeof invoicesApi.refundOverpayment>>>(),
  holds<Equal<Answer<typeof issueStatementsByHand>["issued"], Answer<typeof invoicesApi.issueStatements>>>(),
  holds<Equal<Answer<typeof confirmDispatch>, Answer<typeof dispatchApi.confirm>>>(),
  holds<Equal<Answer<typeof listPayouts>, Answer<typeof payoutsApi.list>>>(),
  holds<Equal<Answer<typeof payoutDetail>, Answer<typeof payoutsApi.get>>>(),
  holds<Equal<Answer<typeof reconcilePayout>, Answer<typeof payoutsApi.reconcile>>>(),
  holds<Equal<Answer<typeof undoReconcile>, Answer<typeof payoutsApi.undoReconcile>>>(),
  holds<Equal<Answer<typeof aging>, Answer<typeof reportsApi.aging>>>(),
  holds<Equal<Answer<typeof getBillingSettings>, Answer<typeof billingSettingsApi.get>>>(),
  holds<Equal<Answer<typeof saveBillingSettings>, Answer<typeof billingSettingsApi.save>>>(),
  holds<Equal<Answer<typeof setPaymentTerms>["paymentTerms"], Answer<typeof accountBillingApi.setTerms>>>(),
  holds<Equal<Answer<typeof listCertificatesFor>["certificates"], Answer<typeof accountBillingApi.certificates>>>(),
  holds<Equal<Answer<typeof uploadCertificate>, Answer<typeof accountBillingApi.upload>>>(),
  holds<Equal<Answer<typeof reviewCertificate>, Answer<typeof accountBillingApi.review>>>(),
  holds<Equal<Answer<typeof remindInvoice>, Answer<typeof invoicesApi.remind>>>(),
  holds<Equal<Answer<typeof remindAllOverdue>, Answer<typeof invoicesApi.remindAllOverdue>>>(),
  // What the client sends is what the server's schema takes.
  holds<Equal<Parameters<typeof invoicesApi.recordPayment>[1], PaymentInput>>(),
  holds<Equal<Parameters<typeof invoicesApi.creditNote>[1], CreditNoteInput>>(),
  holds<Assignable<Parameters<typeof billingSettingsApi.save>[0], Parameters<typeof saveBillingSettings>[1]>>(),
];

type ServerInvoice = ReturnType<typeof invoiceDto>;

/** A rename on one side only is a type error: these lines would compile if the server and client drifted apart. */
export function renamesFail(inv: ServerInvoice): number {
  // @ts-expect-error the server's invoice has no `amountDue`: the field is `amountDueCents`, as the client reads it
  const due: number = inv.amountDue;
  type RenamedOnServer = Omit<ServerInvoice, "amountDueCents"> & { amountDue: number };
  const renamed = { ...inv, amountDue: inv.amountDueCents } as RenamedOnServer;
  // @ts-expect-error a server answer with `amountDueCents` renamed is not the client's InvoiceDto
  const asClient: InvoiceDto = renamed;
  return due + asClient.totalCents;
}

describe("the billing contract", () => {
  it("is checked by the type checker: every server answer is the client's type", () => {
    expect(coupling).toHaveLength(24);
    expect(coupling.every((c) => c === true)).toBe(true);
  });

  it("the server's invoice answer has exactly the fields of the screens' fixture", () => {
    const fixture = invoiceFixture();
    const row: Invoice = {
      id: fixture.id, number: fixture.number, year: 2025, seq: 41, accountId: fixture.accountId, kind: fixture.kind, status: fixture.status,
      issueDate: fixture.issueDate, dueDate: fixture.dueDate, periodStart: null, periodEnd: null, currency: "USD", subtotalCents: 5400, taxRateBp: 875,
      taxCents: 473, totalCents: 5873, creditedCents: 0, paidCents: 0, refundedCents: 0, overpaymentRefundedCents: 0, taxExempt: false,
      sentAt: new Date(fixture.sentAt!), createdAt: new Date(), updatedAt: new Date(),
    };
    // Due on the 1st and read on the 1st: not overdue yet, as the fixture says.
    const dto = invoiceDto(row, fixture.accountName, "2025-12-01");
    expect(Object.keys(dto).sort()).toEqual(Object.keys(fixture).sort());
    expect(JSON.parse(JSON.stringify(dto))).toEqual(fixture);
  });

  it("the fixtures of tests/app carry every field of the detail and payout answers", () => {
    expect(Object.keys(detailFixture()).sort()).toEqual(["alerts", "creditNotes", "emails", "invoice", "lines", "payments", "refunds", "reminders"]);
    expect(Object.keys(payoutFixture()).sort()).toEqual(["feesCents", "grossCents", "history", "netCents", "netMatchesPayout", "payout", "reconciled", "refundsCents", "transactions", "unmatched"]);
  });

  it("the request schemas take what the screens send, with the messages the forms show", () => {
    expect(manualPaymentSchema.parse({ amountCents: 5873, method: "bank_transfer", reference: " BT-0041 ", receivedOn: "2025-12-02" })).toEqual({ amountCents: 5873, method: "bank_transfer", reference: "BT-0041", receivedOn: "2025-12-02" });
    expect(manualPaymentSchema.safeParse({ amountCents: 1, method: "card", reference: "x", receivedOn: "2025-12-02" }).error?.issues[0].message).toBe("Choose bank transfer, check, cash or other.");
    expect(manualPaymentSchema.safeParse({ amountCents: 0.5, method: "cash", reference: "x", receivedOn: "2025-12-02" }).error?.issues[0].message).toBe("Whole cents only.");
    expect(creditNoteSchema.safeParse({ reason: "Crushed", lines: [] }).error?.issues[0].message).toBe("Add what is credited.");
    expect(dispatchConfirmSchema.parse({})).toEqual({ adjustments: [] });
    expect(reconcileSchema.parse({})).toEqual({ note: "", force: false });
    expect(billingSettingsSchema.parse({ salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14 })).toEqual({ salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14, paymentInstructions: "" });
    expect(billingSettingsSchema.safeParse({ salesTaxRateBp: 875, invoicePrefix: "hb", creditHoldDays: 14 }).error?.issues[0].message).toBe("1 to 6 capital letters, e.g. HB.");
    expect(invoiceListQuerySchema.parse({ overdue: "1", sort: "due" })).toEqual({ overdue: true, sort: "due" });
    expect(invoiceListQuerySchema.parse({})).toEqual({ overdue: false });
  });
});
