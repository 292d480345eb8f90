import crypto from "node:crypto";
import { In, LessThan, LessThanOrEqual, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { notFound, conflict } from "../http/errors";
import { OutboxMail } from "./outbox.entity";
import type { OutgoingMail } from "./mailer";

export const MAX_ATTEMPTS = 12;
const SENDING_STALE_MS = 5 * 60 * 1000;

/** Queue a mail inside the caller's transaction: it is sent only if that transaction commits. */
export async function enqueueMail(m: EntityManager, ctx: AppContext, kind: string, mail: OutgoingMail): Promise<OutboxMail> {
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

/**
 * Send what is due. Each row is claimed ("sending") before the SMTP call and marked "sent" after it, so a
 * mail goes at most once; a row left "sending" by a crashed process is retried after 5 minutes with the
 * same Message-ID. Runs under the scheduler's MariaDB named lock, so one instance sends at a time.
 */
export async function processOutbox(ctx: AppContext, limit = 100): Promise<{ sent: number; failed: number }> {
  const repo = ctx.dataSource.getRepository(OutboxMail);
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
      // Sent: a database hiccup here leaves the row "sending"; it is retried (same Message-ID) only after 5 minutes.
      await repo.update({ id: row.id }, { status: "sent", sentAt: ctx.clock.now(), attempts: row.attempts + 1, lastError: null });
      sent++;
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

export interface OutboxRowDto {
  id: number; kind: string; to: string; subject: string; status: string; attempts: number; lastError: string | null;
  nextAttemptAt: string; sentAt: string | null; createdAt: string; messageId: string;
}

export async function listOutbox(ctx: AppContext, status?: string): Promise<OutboxRowDto[]> {
  const rows = await ctx.dataSource.getRepository(OutboxMail).find({ where: status ? { status: status as OutboxMail["status"] } : {}, order: { id: "DESC" }, take: 200 });
  return rows.map((r) => ({ id: r.id, kind: r.kind, to: r.toAddress, subject: r.subject, status: r.status, attempts: r.attempts, lastError: r.lastError, nextAttemptAt: r.nextAttemptAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null, createdAt: r.createdAt.toISOString(), messageId: r.messageId }));
}

/** The owner's "send again" for a failed mail: back in the queue, attempts counted afresh. */
export async function resend(ctx: AppContext, id: number): Promise<void> {
  const repo = ctx.dataSource.getRepository(OutboxMail);
  const row = await repo.findOneBy({ id });
  if (!row) throw notFound("That mail");
  if (row.status !== "failed") throw conflict("not_failed", "Only a mail that failed can be sent again; this one is " + row.status + ".");
  await repo.update({ id, status: "failed" }, { status: "pending", attempts: 0, nextAttemptAt: ctx.clock.now(), lastError: null });
  ctx.kickOutbox?.();
}
