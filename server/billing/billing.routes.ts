import express, { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../http/context";
import { badRequest, conflict, notFound, parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { idSchema } from "../../shared/schemas/common";
import { dateRangeCheck, dateSchema } from "../../shared/schemas/calendar";
import { PAYMENT_TERMS } from "../../shared/billing";
import { ROLES } from "../../shared/roles";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { Bakery } from "../bakery/bakery.entity";
import { refuseAfterToday, resolveAccount } from "../calendar/calendar.service";
import * as invoices from "./invoices.service";
import * as payments from "./payments.service";
import { renderInvoicePdf } from "./invoice.pdf";
import { withJobLock } from "../jobs/scheduler";
import * as certificates from "./certificates.service";
import { checkUpload, singleFileUpload } from "../http/upload";
import { certificateStore } from "../files/file-store";
import { sendStoredFile } from "../files/serve";

const idParam = z.object({ id: idSchema });
const OFFICE = ["owner", "bookkeeper"] as const;
const money = z.number({ error: (issue) => (issue.input === undefined ? undefined : "Enter an amount in cents.") }).int("Whole cents only.").positive("The amount must be more than 0.");

/** Stripe webhooks need the raw body for the signature: mounted before the JSON parser. */
export function stripeWebhookRoute(ctx: AppContext): Router {
  const r = Router();
  r.post("/", express.raw({ type: "*/*", limit: "1mb" }), async (req, res) => {
    // 2xx for every authentic event, rejected ones too (see payments.handleWebhook for why).
    const result = await payments.handleWebhook(ctx, Buffer.isBuffer(req.body) ? req.body : Buffer.from(""), req.get("stripe-signature"));
    res.json({ received: true, duplicate: !result.handled, rejected: result.outcome === "rejected" });
  });
  return r;
}

export function deliveryRoutes(ctx: AppContext): Router {
  const r = Router();
  r.post("/:date/confirm", allow("owner", "baker"), async (req, res) => {
    const { date } = parse(z.object({ date: dateSchema }), req.params);
    const { adjustments } = parse(z.object({ adjustments: z.array(z.object({ orderId: z.number().int().positive(), productId: z.number().int().positive(), deliveredQuantity: z.number().int("Whole units.").min(0, "Cannot be negative."), reason: z.string().trim().max(200).optional() })).max(500).default([]) }), req.body);
    res.json({ result: await invoices.confirmDispatch(ctx, date, adjustments) });
  });
  return r;
}

export function invoiceRoutes(ctx: AppContext): Router {
  const r = Router();
  const listQuery = z.object({
    status: z.enum(["open", "paid", "void", "partially_refunded", "refunded"]).optional(),
    accountId: z.coerce.number().int().positive().optional(),
    from: dateSchema.optional(), to: dateSchema.optional(),
    overdue: z.enum(["1", "true"]).optional().transform((v) => !!v),
    q: z.string().trim().max(80).optional(),
    sort: z.enum(["newest", "oldest", "due", "amount", "account"]).optional(),
  }).superRefine(dateRangeCheck({ from: "from", to: "to" }));
  r.get("/", allow(...OFFICE, "buyer"), async (req, res) => {
    res.json(await invoices.listInvoices(ctx, currentUser(req), parse(listQuery, req.query)));
  });
  r.post("/statements", allow(...OFFICE), async (req, res) => {
    const { through } = parse(z.object({ through: dateSchema.optional() }), req.body);
    await refuseAfterToday(ctx, through, "through", "Statements run through today at the latest.");
    // One run at a time, under the same MariaDB named lock as the weekly job (server/jobs/scheduler.ts).
    const run = await withJobLock(ctx, "weekly-statements", () => invoices.issueStatements(ctx, through));
    if (!run.ran) throw conflict("already_running", "Statements are already being issued; try again in a minute.");
    res.json({ issued: run.value.map((i) => i.number) });
  });
  r.get("/:id", allow(...OFFICE, "buyer"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.json(await invoices.getInvoiceFor(ctx, currentUser(req), id));
  });
  r.get("/:id/pdf", allow(...OFFICE, "buyer"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const detail = await invoices.getInvoiceFor(ctx, currentUser(req), id);
    const account = await ctx.dataSource.getRepository(CustomerAccount).findOneByOrFail({ id: detail.invoice.accountId });
    const pdf = await renderInvoicePdf({ ...detail, bakery: await getBakery(ctx), account });
    res.type("application/pdf").set("Content-Disposition", `inline; filename="${detail.invoice.number}.pdf"`).send(pdf);
  });
  r.post("/:id/checkout", allow(...OFFICE, "buyer"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.status(201).json(await payments.createCheckout(ctx, currentUser(req), id));
  });
  r.post("/:id/payments", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const input = parse(z.object({ amountCents: money, method: z.enum(["bank_transfer", "cheque", "cash", "other"], { error: "Choose bank transfer, check, cash or other." }), reference: z.string().trim().min(1, "Enter the transfer reference or check number.").max(120), receivedOn: dateSchema }), req.body);
    res.status(201).json({ payment: await payments.recordManualPaymentAndExpire(ctx, currentUser(req), id, input) });
  });
  r.post("/:id/overpayment-refund", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParam, req.params);
    res.status(201).json({ refund: await payments.refundOverpayment(ctx, id) });
  });
  r.post("/:id/credit-notes", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const input = parse(z.object({
      reason: z.string().trim().min(1, "Say why (short delivery, damaged, …).").max(300),
      lines: z.array(z.object({ description: z.string().trim().min(1).max(200), quantity: z.number().int().positive("At least 1."), unitPriceCents: z.number().int().positive() })).min(1, "Add what is credited."),
      carry: z.boolean().optional(),
    }), req.body);
    const cn = await payments.issueCreditNote(ctx, id, input);
    res.status(201).json({ creditNote: { id: cn.id, number: cn.number, totalCents: cn.totalCents, disposition: cn.disposition } });
  });
  return r;
}

export function payoutRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...OFFICE));
  r.get("/", async (_req, res) => {
    res.json({ payouts: await payments.listPayouts(ctx) });
  });
  r.get("/:id", async (req, res) => {
    const { id } = parse(z.object({ id: z.string().regex(/^po_[A-Za-z0-9_]+$/, "Not a payout id.") }), req.params);
    res.json(await payments.payoutDetail(ctx, id));
  });
  r.post("/:id/reconcile", async (req, res) => {
    const { id } = parse(z.object({ id: z.string().regex(/^po_[A-Za-z0-9_]+$/, "Not a payout id.") }), req.params);
    const { note, force } = parse(z.object({ note: z.string().trim().max(300).default(""), force: z.boolean().default(false) }), req.body);
    res.json(await payments.reconcilePayout(ctx, currentUser(req), id, note, force));
  });
  return r;
}

export function reportRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow(...OFFICE));
  r.get("/aging", async (_req, res) => {
    res.json({ aging: await payments.aging(ctx) });
  });
  r.get("/exports/:file", async (req, res) => {
    const { file } = parse(z.object({ file: z.enum(["invoices.csv", "payments.csv", "payouts.csv"], { error: "Exports: invoices.csv, payments.csv, payouts.csv." }) }), req.params);
    const csv = await payments.exportCsv(ctx, file.replace(".csv", "") as "invoices" | "payments" | "payouts");
    res.type("text/csv; charset=utf-8").attachment(file).send(csv);
  });
  return r;
}

const billingSettingsSchema = z.object({
  salesTaxRateBp: z.number().int("Use basis points: 875 for 8.75 %.").min(0).max(3000, "At most 30 %."),
  invoicePrefix: z.string().trim().regex(/^[A-Z]{1,6}$/, "1 to 6 capital letters, e.g. HB."),
  creditHoldDays: z.number().int().min(1, "At least 1 day.").max(180),
  paymentInstructions: z.string().trim().max(600).default(""),
});

export function billingSettingsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (_req, res) => {
    const b = await getBakery(ctx);
    res.json({ settings: { salesTaxRateBp: b.salesTaxRateBp, invoicePrefix: b.invoicePrefix, creditHoldDays: b.creditHoldDays, paymentInstructions: b.paymentInstructions } });
  });
  r.put("/", allow("owner"), async (req, res) => {
    const input = parse(billingSettingsSchema, req.body);
    await ctx.dataSource.getRepository(Bakery).update({ id: (await getBakery(ctx)).id }, input);
    res.json({ settings: input });
  });
  return r;
}

/** Per account: payment terms (owner), and resale / tax-exemption certificates (buyer uploads, owner approves). */
export function accountBillingRoutes(ctx: AppContext): Router {
  const r = Router();
  r.put("/:id/terms", allow("owner"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const { paymentTerms } = parse(z.object({ paymentTerms: z.enum(PAYMENT_TERMS, { error: "Choose card, net7, net14 or net30." }) }), req.body);
    const repo = ctx.dataSource.getRepository(CustomerAccount);
    if (!(await repo.existsBy({ id }))) throw notFound("That account");
    await repo.update({ id }, { paymentTerms });
    res.json({ paymentTerms });
  });
  // Certificates (server/billing/certificates.service.ts): quotas per account, expiry range, bytes checked and
  // polyglots refused or re-encoded (server/http/upload.ts), stored by content hash (server/files/file-store.ts).
  r.get("/:id/certificates", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const account = await resolveAccount(ctx, currentUser(req), id);
    res.json(await certificates.listCertificates(ctx, account.id));
  });
  r.post("/:id/certificates", allow("owner", "buyer"), async (req, _res, next) => {
    // Before the body is read: the account exists and is the buyer's own, and it has room left.
    const { id } = parse(idParam, req.params);
    const account = await resolveAccount(ctx, currentUser(req), id);
    await certificates.assertRoomBeforeUpload(ctx, account.id);
    next();
  }, singleFileUpload(certificates.CERTIFICATE_UPLOAD), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const account = await resolveAccount(ctx, currentUser(req), id);
    const { expiresOn } = parse(z.object({ expiresOn: dateSchema }), req.body);
    certificates.checkExpiry(expiresOn, await certificates.expiryRange(ctx));
    if (!req.file) throw badRequest("Attach the certificate (PDF, JPEG or PNG).", { file: "Attach the certificate." });
    const checked = await checkUpload(req.file.buffer, certificates.CERTIFICATE_UPLOAD);
    res.status(201).json({ certificate: await certificates.addCertificate(ctx, account.id, checked, expiresOn) });
  });
  return r;
}

export function certificateRoutes(ctx: AppContext): Router {
  const r = Router();
  r.post("/:id/review", allow("owner"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const { status } = parse(z.object({ status: z.enum(["approved", "rejected"], { error: "Choose approved or rejected." }) }), req.body);
    res.json({ certificate: await certificates.reviewCertificate(ctx, currentUser(req), id, status) });
  });
  /** Downloaded, never shown inline or cached: attachment, private no-store, nosniff (server/files/serve.ts). */
  r.get("/:id/file", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParam, req.params);
    const c = await certificates.certificateFor(ctx, currentUser(req), id);
    await sendStoredFile(req, res, certificateStore(ctx.config), c.row.file, { kind: "private-attachment", filename: c.filename }, c.contentType);
  });
  return r;
}
