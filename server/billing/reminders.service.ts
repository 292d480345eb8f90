import { In, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { conflict, notFound } from "../http/errors";
import { Invoice } from "./invoice.entity";
import { InvoiceReminder } from "./invoice-reminder.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { Bakery } from "../bakery/bakery.entity";
import { getBakery } from "../bakery/bakery.service";
import { enqueueMail } from "../mail/outbox.service";
import { reminderMail } from "../mail/templates";
import { amountDue, dueReminderStage, type ReminderStage } from "../../shared/billing";
import { localToday } from "../../shared/calendar";
import type { SessionUser } from "../../shared/schemas/auth";
import type { InvoiceReminderDto, RemindAllResponse } from "../../shared/contracts/billing";

export const reminderDto = (r: InvoiceReminder): InvoiceReminderDto => ({ id: r.id, invoiceId: r.invoiceId, stage: r.stage, sentById: r.sentById, at: r.createdAt.toISOString() });

/**
 * Queue a payment reminder for an unpaid invoice (through the outbox, so it goes out once the write commits) and
 * record it on the invoice. `actor` null: the schedule sent it.
 */
export async function remindInvoice(ctx: AppContext, actor: SessionUser | null, invoiceId: number, stage: ReminderStage = "manual"): Promise<InvoiceReminderDto> {
  return (await remindLocked(ctx, actor, invoiceId, stage, () => false))!;
}

/**
 * The reminder, written under the invoice's row lock; `skip` looks at the invoice's earlier reminders under that
 * same lock, so two presses (or a press and the schedule) at once cannot both send the one meant to go once.
 */
async function remindLocked(ctx: AppContext, actor: SessionUser | null, invoiceId: number, stage: ReminderStage, skip: (earlier: InvoiceReminder[], timeZone: string) => boolean): Promise<InvoiceReminderDto | null> {
  return ctx.dataSource.transaction(async (m) => {
    const inv = await m.getRepository(Invoice).createQueryBuilder("i").setLock("pessimistic_write").where("i.id = :id", { id: invoiceId }).getOne();
    if (!inv) throw notFound("That invoice");
    if (inv.status !== "open" || amountDue(inv) <= 0) throw conflict("nothing_due", `${inv.number} has nothing left to pay, so there is nothing to remind about.`);
    const earlier = await m.getRepository(InvoiceReminder).find({ where: { invoiceId }, order: { id: "ASC" } });
    if (skip(earlier, (await getBakery(ctx, m)).timeZone)) return null;
    return reminderFor(ctx, m, inv, actor, stage);
  });
}

async function reminderFor(ctx: AppContext, m: EntityManager, inv: Invoice, actor: SessionUser | null, stage: ReminderStage): Promise<InvoiceReminderDto> {
  const bakery = await getBakery(ctx, m);
  const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId });
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const mail = reminderMail({
    bakeryName: bakery.name, currency: inv.currency, locale: bakery.locale, number: inv.number, totalCents: inv.totalCents, dueCents: amountDue(inv), dueDate: inv.dueDate, today,
    url: `${ctx.config.publicUrl}/buyer/invoices/${inv.id}`, card: account.paymentTerms === "card", instructions: bakery.paymentInstructions, statement: inv.kind === "statement",
  });
  const queued = await enqueueMail(m, ctx, "reminder", { to: account.billingEmail, fromName: bakery.name, ...mail });
  const row = await m.getRepository(InvoiceReminder).save(m.getRepository(InvoiceReminder).create({ invoiceId: inv.id, stage, sentById: actor?.id ?? null, outboxMailId: queued.id, createdAt: ctx.clock.now() }));
  ctx.logger.info({ invoiceId: inv.id, stage, by: actor?.id ?? "schedule" }, "payment reminder queued");
  return reminderDto(row);
}

/** Open invoices with money owed (overdue only: due before today). */
async function unpaid(ctx: AppContext, today: string, overdueOnly: boolean): Promise<Invoice[]> {
  const open = await ctx.dataSource.getRepository(Invoice).find({ where: { status: "open" }, order: { dueDate: "ASC", id: "ASC" } });
  return open.filter((i) => amountDue(i) > 0 && (!overdueOnly || i.dueDate < today));
}

/** The reminders already recorded for these invoices, by invoice. */
async function remindersOf(ctx: AppContext, ids: number[]): Promise<Map<number, InvoiceReminder[]>> {
  const rows = ids.length ? await ctx.dataSource.getRepository(InvoiceReminder).find({ where: { invoiceId: In(ids) }, order: { id: "ASC" } }) : [];
  const by = new Map<number, InvoiceReminder[]>();
  for (const r of rows) by.set(r.invoiceId, [...(by.get(r.invoiceId) ?? []), r]);
  return by;
}

/** "Remind all overdue": one reminder per overdue invoice, leaving out any already reminded today (no double mail). */
export async function remindAllOverdue(ctx: AppContext, actor: SessionUser): Promise<RemindAllResponse> {
  const bakery = await getBakery(ctx);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const overdue = await unpaid(ctx, today, true);
  const result: RemindAllResponse = { sent: [], skipped: [] };
  for (const inv of overdue) {
    const sent = await remindLocked(ctx, actor, inv.id, "manual", (earlier, tz) => earlier.some((r) => localToday(r.createdAt, tz) === today));
    (sent ? result.sent : result.skipped).push(inv.number);
  }
  return result;
}

/** The scheduled job: when the bakery has turned reminders on, each unpaid invoice gets the stage it is due for today. */
export async function runReminderSchedule(ctx: AppContext): Promise<number> {
  const bakery = await getBakery(ctx);
  if (!bakery.remindersOn) return 0;
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const open = await unpaid(ctx, today, false);
  const sentBefore = await remindersOf(ctx, open.map((i) => i.id));
  let sent = 0;
  for (const inv of open) {
    const stage = dueReminderStage({ issueDate: inv.issueDate, dueDate: inv.dueDate, today, sent: (sentBefore.get(inv.id) ?? []).map((r) => r.stage) });
    if (!stage) continue;
    try {
      // Checked again under the lock: the stage goes out once even if another run got there first.
      if (await remindLocked(ctx, null, inv.id, stage, (earlier) => earlier.some((r) => r.stage === stage))) sent++;
    } catch (err) {
      ctx.logger.warn({ err, invoiceId: inv.id }, "scheduled payment reminder not queued");
    }
  }
  return sent;
}

/** Turn the reminder schedule on or off (owner or bookkeeper). */
export async function setRemindersOn(ctx: AppContext, on: boolean): Promise<{ remindersOn: boolean }> {
  await ctx.dataSource.getRepository(Bakery).update({ id: (await getBakery(ctx)).id }, { remindersOn: on });
  return { remindersOn: on };
}

/** An invoice's reminders, oldest first (for its detail page). */
export async function invoiceReminders(m: EntityManager, invoiceId: number): Promise<InvoiceReminderDto[]> {
  return (await m.getRepository(InvoiceReminder).find({ where: { invoiceId }, order: { id: "ASC" } })).map(reminderDto);
}
