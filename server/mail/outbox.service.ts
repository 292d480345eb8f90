import crypto from "node:crypto";
import { In, LessThan, LessThanOrEqual, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { notFound, conflict } from "../http/errors";
import { OutboxMail } from "./outbox.entity";
import type { OutgoingMail } from "./mailer";
import { isDatabaseUnavailable } from "../db/retry";
import type { MailKind } from "../../shared/mail";
import type { MailStatus } from "../../shared/schemas/outbox";
import type { OutboxMailDto } from "../../shared/contracts/outbox";

export const MAX_ATTEMPTS = 12;
const SENDING_STALE_MS = 5 * 60 * 1000;

/** Queue a mail inside the caller's transaction: it is sent only if that transaction commits. */
export async function enqueueMail(m: EntityManager, ctx: AppContext, kind: MailKind, mail: OutgoingMail): Promise<OutboxMail> {
  const domain = new URL(ctx.config.publicUrl).hostname || "panwise.local";
  const row = m.getRepository(OutboxMail).create({
    messageId: `<${kind}.${Date.now().toString(36)}.${crypto.randomBytes(8).toString("hex")}@${domain}>`,
    kind,
    toAddress: mail.to,
    fromName: mail.fromName,
    subject: mail.subject.slice(0, 300),
    html: mail.html,
    text: mail.text,
    attachments: mail.attachments?.length ? JSON.stringify(mail.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, base64: a.content.toString("base64") }))) : null,
    status: "pending",
    attempts: 0,
    nextAttemptAt: ctx.clock.now(),
  });
  const saved = await m.getRepository(OutboxMail).save(row);
  ctx.kickOutbox?.();
  return saved;
}

const backoffMs = (attempts: number) => Math.min(5 * 60 * 1000, 1000 * 2 ** Math.max(0, attempts - 1));

/** Waits between tries at recording "sent" while the database does not answer (about 4 s in all). */
export const MARK_SENT_RETRY_MS = [100, 250, 500, 1000, 2000];

/**
 * Mails the mail server accepted whose "sent" could not be written yet (the database was unreachable), per
 * DataSource: written first thing in the next round, before any row left "sending" goes back in the queue.
 */
const unrecorded = new WeakMap<object, Map<number, { sentAt: Date; attempts: number }>>();
function unrecordedOf(ctx: AppContext) {
  let m = unrecorded.get(ctx.dataSource);
  if (!m) unrecorded.set(ctx.dataSource, (m = new Map()));
  return m;
}

/** Record "sent" right after the SMTP accept, holding the row's claim; try again for a few seconds while the database is away. */
async function markSent(ctx: AppContext, id: number, sentAt: Date, attempts: number): Promise<boolean> {
  const repo = ctx.dataSource.getRepository(OutboxMail);
  for (let i = 0; ; i++) {
    try {
      await repo.update({ id }, { status: "sent", sentAt, attempts, lastError: null });
      return true;
    } catch (err) {
      if (!isDatabaseUnavailable(err)) throw err;
      if (i >= MARK_SENT_RETRY_MS.length) return false;
      await new Promise((r) => setTimeout(r, MARK_SENT_RETRY_MS[i]));
    }
  }
}

/**
 * Send what is due. At-least-once: each row is claimed ("sending") before the SMTP call and marked "sent"
 * right after the server accepts it. If the database is unreachable at that moment, this process retries the
 * mark for a few seconds and then keeps it in memory, writing it first in the next round; only when the
 * process itself dies in that gap does the row, after 5 minutes "sending", go out again — with the same
 * Message-ID, so mail clients can tell it is a repeat. Runs under the scheduler's MariaDB named lock, so one
 * instance sends at a time.
 */
export async function processOutbox(ctx: AppContext, limit = 100): Promise<{ sent: number; failed: number }> {
  const repo = ctx.dataSource.getRepository(OutboxMail);
  const pendingMarks = unrecordedOf(ctx);
  for (const [id, mark] of [...pendingMarks]) {
    await repo.update({ id }, { status: "sent", sentAt: mark.sentAt, attempts: mark.attempts, lastError: null });
    pendingMarks.delete(id);
  }
  const now = ctx.clock.now();
  await repo.update({ status: "sending", nextAttemptAt: LessThan(new Date(now.getTime() - SENDING_STALE_MS)) }, { status: "pending" });
  const due = await repo.find({ where: { status: "pending", nextAttemptAt: LessThanOrEqual(now) }, order: { id: "ASC" }, take: limit });
  let sent = 0;
  let failed = 0;
  for (const row of due) {
    const claim = await repo.update({ id: row.id, status: "pending" }, { status: "sending", nextAttemptAt: ctx.clock.now() });
    if (!claim.affected) continue;
    let sendError: unknown = null;
    try {
      await ctx.mailer.send({
        to: row.toAddress,
        fromName: row.fromName,
        subject: row.subject,
        html: row.html,
        text: row.text,
        messageId: row.messageId,
        attachments: row.attachments ? (JSON.parse(row.attachments) as { filename: string; contentType: string; base64: string }[]).map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.base64, "base64") })) : undefined,
      });
    } catch (err) {
      sendError = err;
    }
    if (!sendError) {
      sent++;
      const sentAt = ctx.clock.now();
      if (!(await markSent(ctx, row.id, sentAt, row.attempts + 1))) {
        // Still no database: remember it here, so the next round records it instead of sending it again.
        pendingMarks.set(row.id, { sentAt, attempts: row.attempts + 1 });
        ctx.logger.warn({ outboxId: row.id, event: "mail_sent_unrecorded" }, "mail sent but the database is unreachable; recording it when it is back");
        break;
      }
    } else {
      const err = sendError;
      const attempts = row.attempts + 1;
      const message = String((err as Error).message || err).slice(0, 500);
      await repo.update({ id: row.id }, { status: attempts >= MAX_ATTEMPTS ? "failed" : "pending", attempts, lastError: message, nextAttemptAt: new Date(ctx.clock.now().getTime() + backoffMs(attempts)) });
      failed++;
      ctx.logger.warn({ outboxId: row.id, attempts, event: "mail_send_failed", err: message }, "mail not sent; will retry");
      // The mail server is probably down: leave the rest for the next round instead of failing each one.
      if (/ECONNREFUSED|ETIMEDOUT|ECONNRESET|EHOSTUNREACH/.test(message)) {
        const rest = due.slice(due.indexOf(row) + 1).map((r) => r.id);
        if (rest.length) await repo.update({ id: In(rest), status: "pending" }, { nextAttemptAt: new Date(ctx.clock.now().getTime() + backoffMs(1)) });
        break;
      }
    }
  }
  return { sent, failed };
}

export async function listOutbox(ctx: AppContext, status?: MailStatus, kinds: readonly MailKind[] | null = null): Promise<OutboxMailDto[]> {
  const where = { ...(status ? { status } : {}), ...(kinds ? { kind: In([...kinds]) } : {}) };
  const rows = await ctx.dataSource.getRepository(OutboxMail).find({ where, order: { id: "DESC" }, take: 200 });
  return rows.map((r) => ({ id: r.id, kind: r.kind, to: r.toAddress, subject: r.subject, status: r.status, attempts: r.attempts, lastError: r.lastError, nextAttemptAt: r.nextAttemptAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null, createdAt: r.createdAt.toISOString(), messageId: r.messageId }));
}

/** "Send again" for a failed mail: back in the queue, attempts counted afresh. A kind the caller may not see is 404. */
export async function resend(ctx: AppContext, id: number, kinds: readonly MailKind[] | null = null): Promise<void> {
  const repo = ctx.dataSource.getRepository(OutboxMail);
  const row = await repo.findOneBy({ id });
  if (!row || (kinds && !kinds.includes(row.kind as MailKind))) throw notFound("That mail");
  if (row.status !== "failed") throw conflict("not_failed", `Only a mail that failed can be sent again; this one ${row.status === "sent" ? "has been sent" : "is still waiting to go"}.`);
  await repo.update({ id, status: "failed" }, { status: "pending", attempts: 0, nextAttemptAt: ctx.clock.now(), lastError: null });
  ctx.kickOutbox?.();
}
