import { DateTime } from "luxon";
import { In, IsNull, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { conflict, notFound } from "../http/errors";
import { CreditNote } from "./credit-note.entity";
import { DeliveryAdjustment } from "./delivery-adjustment.entity";
import { Invoice } from "./invoice.entity";
import { InvoiceLine } from "./invoice-line.entity";
import { Payment } from "./payment.entity";
import { Refund } from "./refund.entity";
import { StripeEventRecord } from "./stripe-event.entity";
import { Order } from "../orders/order.entity";
import { OrderLine } from "../orders/order-line.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { refuseAfterToday } from "../calendar/calendar.service";
import { withJobLock } from "../jobs/scheduler";
import { enqueueMail } from "../mail/outbox.service";
import { OutboxMail } from "../mail/outbox.entity";
import { invoiceMail } from "../mail/templates";
import { invoiceReminders } from "./reminders.service";
import { renderInvoicePdf } from "./invoice.pdf";
import { retryOnDeadlock } from "../db/retry";
import { allocateNumber, createCreditNote, overpaidCents, refreshStatus, validExemption } from "./ledger.service";
import { amountDue, dueDate, formatDocNumber, invoiceTotals, type PaymentTerms } from "../../shared/billing";
import { addDays, localToday } from "../../shared/calendar";
import { toDecimal } from "../../shared/money";
import type { SessionUser } from "../../shared/schemas/auth";
import type { InvoiceListQuery } from "../../shared/schemas/billing";
import type { InvoiceDetailDto, InvoiceDto, InvoiceListDto, StatementsResponse } from "../../shared/contracts/billing";
import { quantityText } from "../../shared/quantity";

// ---- issuing --------------------------------------------------------------------------------------

/**
 * Issue one invoice for a set of delivered orders of one account: lines at the prices copied on the
 * orders, tax unless a valid exemption is held, then credit notes for anything delivered short
 * (applied to this invoice) and for credit carried from earlier invoices. Mails it with its PDF.
 */
export async function issueInvoice(ctx: AppContext, m: EntityManager, account: CustomerAccount, orderIds: number[], kind: "order" | "statement", period?: { start: string; end: string }): Promise<Invoice | null> {
  const bakery = await getBakery(ctx, m);
  const lines = await m.getRepository(OrderLine).createQueryBuilder("l")
    .innerJoin(Order, "o", "o.id = l.orderId")
    .leftJoin(InvoiceLine, "il", "il.orderLineId = l.id")
    .where("l.orderId IN (:...ids) AND il.id IS NULL AND o.status = 'delivered'", { ids: orderIds.concat([0]) })
    .select(["l.id AS id", "l.orderId AS orderId", "o.deliveryDate AS deliveryDate", "l.productId AS productId", "l.productName AS productName", "l.saleUnit AS saleUnit", "l.saleUnitPlural AS saleUnitPlural", "l.quantity AS quantity", "l.unitPriceCents AS unitPriceCents", "l.lineTotalCents AS lineTotalCents"])
    .orderBy("o.deliveryDate").addOrderBy("l.id").getRawMany<{ id: number; orderId: number; deliveryDate: string; productId: number; productName: string; saleUnit: string; saleUnitPlural: string; quantity: number; unitPriceCents: number; lineTotalCents: number }>();
  if (!lines.length) return null;
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const exemption = await validExemption(m, account.id, today);
  const rateBp = exemption ? 0 : bakery.salesTaxRateBp;
  const totals = invoiceTotals(lines.map((l) => ({ amountCents: l.lineTotalCents })), rateBp);
  const year = Number(today.slice(0, 4));
  const seq = await allocateNumber(m, "invoice", year);
  const inv = await m.getRepository(Invoice).save(m.getRepository(Invoice).create({
    number: formatDocNumber(bakery.invoicePrefix, year, seq), year, seq, accountId: account.id, kind, status: "open",
    issueDate: today, dueDate: dueDate(today, account.paymentTerms as PaymentTerms), periodStart: period?.start ?? null, periodEnd: period?.end ?? null,
    currency: bakery.currency, subtotalCents: totals.subtotalCents, taxRateBp: rateBp, taxCents: totals.taxCents, totalCents: totals.totalCents,
    creditedCents: 0, paidCents: 0, refundedCents: 0, taxExempt: !!exemption, sentAt: null,
  }));
  await m.getRepository(InvoiceLine).insert(lines.map((l) => ({
    invoiceId: inv.id, orderLineId: l.id, orderId: l.orderId, deliveryDate: String(l.deliveryDate).slice(0, 10),
    // The unit the price is for (the Qty column holds the count; a credit note copies this description with its own count).
    description: `${l.productName} (${l.saleUnit})`, quantity: l.quantity, unitPriceCents: l.unitPriceCents, amountCents: l.lineTotalCents,
  })));

  // Short deliveries on these orders become a credit note applied to this invoice.
  const adjustments = await m.getRepository(DeliveryAdjustment).findBy({ orderId: In([...new Set(lines.map((l) => l.orderId))]), creditNoteId: IsNull() });
  const shortLines = adjustments.flatMap((a) => {
    const l = lines.find((x) => x.orderId === a.orderId && x.productId === a.productId);
    if (!l || a.deliveredQuantity >= l.quantity) return [];
    const q = l.quantity - a.deliveredQuantity;
    return [{ description: `${l.productName}: delivered ${a.deliveredQuantity} of ${quantityText(l.quantity, l)}${a.reason ? `: ${a.reason}` : ""}`, quantity: q, unitPriceCents: l.unitPriceCents, amountCents: q * l.unitPriceCents }];
  });
  if (shortLines.length) {
    const cn = await createCreditNote(ctx, m, inv, shortLines, "Short delivery", "applied");
    await m.getRepository(DeliveryAdjustment).update({ id: In(adjustments.map((a) => a.id)) }, { creditNoteId: cn.id });
  }
  // Credit carried from earlier invoices of this account comes off this one, up to what it owes.
  const carried = await m.getRepository(CreditNote).findBy({ accountId: account.id, disposition: "carry", carriedToInvoiceId: IsNull() });
  for (const cn of carried) {
    const fresh = await m.getRepository(Invoice).findOneByOrFail({ id: inv.id });
    if (amountDue(fresh) < cn.totalCents) continue;
    // Conditional: a credit claimed by another invoice being issued at the same moment is not applied twice.
    const claim = await m.getRepository(CreditNote).update({ id: cn.id, carriedToInvoiceId: IsNull() }, { carriedToInvoiceId: inv.id });
    if (claim.affected === 1) await m.getRepository(Invoice).increment({ id: inv.id }, "creditedCents", cn.totalCents);
  }
  const issued = await refreshStatus(m, inv.id);
  await queueInvoiceMail(ctx, m, issued, account);
  return issued;
}

async function queueInvoiceMail(ctx: AppContext, m: EntityManager, inv: Invoice, account: CustomerAccount) {
  const bakery = await getBakery(ctx, m);
  const detail = await invoiceDetail(ctx, inv.id, m);
  const pdf = await renderInvoicePdf({ ...detail, bakery, account });
  const mail = invoiceMail({ bakeryName: bakery.name, currency: bakery.currency, locale: bakery.locale, number: inv.number, totalCents: inv.totalCents, dueCents: amountDue(inv), dueDate: inv.dueDate, url: `${ctx.config.publicUrl}/buyer/invoices/${inv.id}`, card: account.paymentTerms === "card", instructions: bakery.paymentInstructions, statement: inv.kind === "statement" });
  await enqueueMail(m, ctx, "invoice", { to: account.billingEmail, fromName: bakery.name, ...mail, attachments: [{ filename: `${inv.number}.pdf`, contentType: "application/pdf", content: pdf }] });
  await m.getRepository(Invoice).update({ id: inv.id }, { sentAt: ctx.clock.now() });
}

/**
 * Weekly statements for accounts on terms: every delivered, not-yet-invoiced order before the start of
 * this week (Monday), or up to `through` when the office issues them by hand.
 */
export async function issueStatements(ctx: AppContext, through?: string): Promise<Invoice[]> {
  const bakery = await getBakery(ctx);
  const today = DateTime.fromISO(localToday(ctx.clock.now(), bakery.timeZone));
  const end = through ?? today.startOf("week").minus({ days: 1 }).toISODate()!;
  const rows: { accountId: number; orderId: number; deliveryDate: string }[] = await ctx.dataSource.query(
    `SELECT DISTINCT o.accountId, o.id AS orderId, o.deliveryDate FROM customer_order o
       JOIN customer_account a ON a.id = o.accountId AND a.paymentTerms <> 'card'
       JOIN order_line l ON l.orderId = o.id LEFT JOIN invoice_line il ON il.orderLineId = l.id
      WHERE o.status = 'delivered' AND o.deliveryDate <= ? AND il.id IS NULL`, [end]);
  const byAccount = new Map<number, { ids: number[]; start: string }>();
  for (const r of rows) {
    const e = byAccount.get(r.accountId) ?? { ids: [], start: String(r.deliveryDate).slice(0, 10) };
    e.ids.push(r.orderId);
    if (String(r.deliveryDate).slice(0, 10) < e.start) e.start = String(r.deliveryDate).slice(0, 10);
    byAccount.set(r.accountId, e);
  }
  const out: Invoice[] = [];
  for (const [accountId, { ids, start }] of byAccount) {
    const inv = await retryOnDeadlock(() => ctx.dataSource.transaction(async (m) => {
      const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: accountId });
      return issueInvoice(ctx, m, account, ids, "statement", { start, end });
    }));
    if (inv) out.push(inv);
  }
  return out;
}

/**
 * The office issues statements by hand through `through` (today at the latest): one run at a time, under the
 * same MariaDB named lock as the weekly job (server/jobs/scheduler.ts); 409 while another run holds it.
 */
export async function issueStatementsByHand(ctx: AppContext, through?: string): Promise<StatementsResponse> {
  await refuseAfterToday(ctx, through, "through", "Statements run through today at the latest.");
  const run = await withJobLock(ctx, "weekly-statements", () => issueStatements(ctx, through));
  if (!run.ran) throw conflict("already_running", "Statements are already being issued; try again in a minute.");
  return { issued: run.value.map((i) => i.number) };
}

/** The job: invoices overdue by more than the bakery's hold days put the account on credit hold; paying lifts it. */
export async function applyCreditHolds(ctx: AppContext): Promise<{ held: number; lifted: number }> {
  const bakery = await getBakery(ctx);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const limit = addDays(today, -bakery.creditHoldDays);
  const overdue: { accountId: number }[] = await ctx.dataSource.query("SELECT DISTINCT accountId FROM invoice WHERE status = 'open' AND dueDate < ?", [limit]);
  const overdueIds = new Set(overdue.map((r) => Number(r.accountId)));
  const repo = ctx.dataSource.getRepository(CustomerAccount);
  let held = 0;
  let lifted = 0;
  for (const id of overdueIds) {
    const res = await repo.update({ id, status: "active" }, { status: "on_hold", creditHold: true });
    held += res.affected ?? 0;
  }
  for (const a of await repo.findBy({ creditHold: true })) {
    if (!overdueIds.has(a.id)) {
      await repo.update({ id: a.id }, { status: a.status === "on_hold" ? "active" : a.status, creditHold: false });
      lifted++;
    }
  }
  return { held, lifted };
}

// ---- reading --------------------------------------------------------------------------------------------

export async function invoiceDetail(ctx: AppContext, id: number, m: EntityManager = ctx.dataSource.manager): Promise<InvoiceDetailDto> {
  const inv = await m.getRepository(Invoice).findOneBy({ id });
  if (!inv) throw notFound("That invoice");
  // The invoice's own mails (the invoice itself and payment receipts) name its number in the subject.
  const emails = await m.getRepository(OutboxMail).createQueryBuilder("o")
    .where("o.kind IN ('invoice', 'receipt', 'reminder') AND o.subject LIKE :n", { n: `%${inv.number}%` }).orderBy("o.id", "ASC").getMany();
  const [lines, payments, credits, refunds, account, rejected] = await Promise.all([
    m.getRepository(InvoiceLine).find({ where: { invoiceId: id }, order: { deliveryDate: "ASC", id: "ASC" } }),
    m.getRepository(Payment).find({ where: { invoiceId: id }, order: { id: "ASC" } }),
    m.getRepository(CreditNote).find({ where: [{ invoiceId: id }, { carriedToInvoiceId: id }], order: { id: "ASC" } }),
    m.getRepository(Refund).find({ where: { invoiceId: id }, order: { id: "ASC" } }),
    m.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId }),
    m.getRepository(StripeEventRecord).find({ where: { invoiceId: id, outcome: "rejected" }, order: { receivedAt: "DESC" }, take: 20 }),
  ]);
  // For the bookkeeper: money paid twice (refund it in one action), and payment events that were refused.
  const over = overpaidCents(inv);
  const alerts = [
    ...(over > 0 ? [{ kind: "overpayment" as const, amountCents: over, eventId: null, at: null, message: `This invoice was paid more than it owes: ${toDecimal(over, inv.currency)} ${inv.currency} came in after it was settled. Refund it to the card.` }] : []),
    ...rejected.map((e) => ({ kind: "rejected_event" as const, amountCents: null, eventId: e.id, at: e.receivedAt.toISOString(), message: `A payment notice from Stripe (${e.type}) was rejected and not applied: ${e.reason}` })),
  ];
  return {
    invoice: { ...invoiceDto(inv, account.businessName, localToday(ctx.clock.now(), (await getBakery(ctx, m)).timeZone)) },
    lines: lines.map((l) => ({ id: l.id, orderId: l.orderId, deliveryDate: l.deliveryDate, description: l.description, quantity: l.quantity, unitPriceCents: l.unitPriceCents, amountCents: l.amountCents })),
    payments: payments.map((p) => ({ id: p.id, method: p.method, amountCents: p.amountCents, reference: p.reference, receivedOn: p.receivedOn, stripePaymentIntentId: p.stripePaymentIntentId, stripeChargeId: p.stripeChargeId })),
    creditNotes: credits.map((c) => ({ id: c.id, number: c.number, reason: c.reason, totalCents: c.totalCents, subtotalCents: c.subtotalCents, taxCents: c.taxCents, disposition: c.disposition, issueDate: c.issueDate, lines: JSON.parse(c.lines), carriedFromInvoiceId: c.carriedToInvoiceId === id ? c.invoiceId : null })),
    refunds: refunds.map((r) => ({ id: r.id, stripeRefundId: r.stripeRefundId, amountCents: r.amountCents, overpayment: r.overpayment, createdAt: r.createdAt.toISOString() })),
    alerts,
    emails: emails.map((e) => ({ id: e.id, kind: e.kind, to: e.toAddress, subject: e.subject, status: e.status, sentAt: e.sentAt?.toISOString() ?? null, createdAt: e.createdAt.toISOString() })),
    reminders: await invoiceReminders(m, id),
  };
}

export function invoiceDto(inv: Invoice, accountName: string, today: string): InvoiceDto {
  const due = amountDue(inv);
  return {
    id: inv.id, number: inv.number, accountId: inv.accountId, accountName, kind: inv.kind, status: inv.status, issueDate: inv.issueDate, dueDate: inv.dueDate,
    periodStart: inv.periodStart, periodEnd: inv.periodEnd, currency: inv.currency, subtotalCents: inv.subtotalCents, taxRateBp: inv.taxRateBp, taxCents: inv.taxCents,
    totalCents: inv.totalCents, creditedCents: inv.creditedCents, paidCents: inv.paidCents, refundedCents: inv.refundedCents, amountDueCents: due, overpaidCents: overpaidCents(inv),
    overdue: inv.status === "open" && due > 0 && inv.dueDate < today, taxExempt: inv.taxExempt, sentAt: inv.sentAt?.toISOString() ?? null,
  };
}

export async function listInvoices(ctx: AppContext, actor: SessionUser, q: InvoiceListQuery): Promise<InvoiceListDto> {
  const bakery = await getBakery(ctx);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const qb = ctx.dataSource.getRepository(Invoice).createQueryBuilder("i").innerJoin(CustomerAccount, "a", "a.id = i.accountId").addSelect("a.businessName", "accountName");
  if (actor.role === "buyer") qb.andWhere("i.accountId = :acc", { acc: actor.accountId });
  else if (q.accountId) qb.andWhere("i.accountId = :acc", { acc: q.accountId });
  if (q.status) qb.andWhere("i.status = :s", { s: q.status });
  if (q.from) qb.andWhere("i.issueDate >= :from", { from: q.from });
  if (q.to) qb.andWhere("i.issueDate <= :to", { to: q.to });
  if (q.overdue) qb.andWhere("i.status = 'open' AND i.dueDate < :today", { today });
  if (q.q) qb.andWhere("(i.number LIKE :q OR a.businessName LIKE :q)", { q: `%${q.q.replace(/[%_\\]/g, "\\$&")}%` });
  const sorts: Record<string, [string, "ASC" | "DESC"]> = { newest: ["i.id", "DESC"], oldest: ["i.id", "ASC"], due: ["i.dueDate", "ASC"], amount: ["i.totalCents", "DESC"], account: ["a.businessName", "ASC"] };
  const [col, dir] = sorts[q.sort ?? "newest"] ?? sorts.newest;
  qb.orderBy(col, dir).addOrderBy("i.id", "DESC").take(1000);
  const { entities, raw } = await qb.getRawAndEntities();
  const rows = entities.map((inv, i) => invoiceDto(inv, (raw[i] as { accountName: string }).accountName, today));
  return {
    invoices: rows,
    totals: { count: rows.length, totalCents: rows.reduce((s, r) => s + r.totalCents, 0), dueCents: rows.reduce((s, r) => s + r.amountDueCents, 0), paidCents: rows.reduce((s, r) => s + r.paidCents, 0), overpaidCount: rows.filter((r) => r.overpaidCents > 0).length },
  };
}

export async function getInvoiceFor(ctx: AppContext, actor: SessionUser, id: number): Promise<InvoiceDetailDto> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneBy({ id });
  if (!inv || (actor.role === "buyer" && inv.accountId !== actor.accountId)) throw notFound("That invoice");
  return invoiceDetail(ctx, id);
}

/** The invoice as a PDF, for whoever may read it (a buyer only their own account's). */
export async function invoicePdfFor(ctx: AppContext, actor: SessionUser, id: number): Promise<{ filename: string; pdf: Buffer }> {
  const detail = await getInvoiceFor(ctx, actor, id);
  const account = await ctx.dataSource.getRepository(CustomerAccount).findOneByOrFail({ id: detail.invoice.accountId });
  const pdf = await renderInvoicePdf({ ...detail, bakery: await getBakery(ctx), account });
  return { filename: `${detail.invoice.number}.pdf`, pdf };
}
