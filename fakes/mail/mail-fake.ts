import http from "node:http";
import type { AddressInfo } from "node:net";
import express from "express";
import { SMTPServer } from "smtp-server";
import { simpleParser, type ParsedMail } from "mailparser";

/**
 * A local stand-in for an SMTP provider: accepts every message on SMTP and shows it on an
 * inbox page and a JSON API. Messages are kept in memory; it is a test double, not a mail server.
 */
export interface StoredMail {
  id: number;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  date: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number; content: Buffer }[];
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  messages: StoredMail[];
  clear(): void;
  close(): Promise<void>;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function toStored(id: number, parsed: ParsedMail, rcpt: string[]): StoredMail {
  const from = parsed.from?.text ?? "";
  return {
    id,
    messageId: parsed.messageId ?? null,
    from,
    to: rcpt,
    subject: parsed.subject ?? "",
    date: (parsed.date ?? new Date()).toISOString(),
    text: parsed.text ?? "",
    html: typeof parsed.html === "string" ? parsed.html : null,
    attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? "attachment", contentType: a.contentType, size: a.size, content: a.content })),
  };
}

const summary = (m: StoredMail) => ({
  id: m.id, messageId: m.messageId, from: m.from, to: m.to, subject: m.subject, date: m.date, text: m.text, html: m.html,
  attachments: m.attachments.map((a, i) => ({ index: i, filename: a.filename, contentType: a.contentType, size: a.size })),
});

export async function startMailFake(opts: { smtpPort?: number; httpPort?: number; host?: string } = {}): Promise<MailFake> {
  const host = opts.host ?? "127.0.0.1";
  const messages: StoredMail[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    // On close, drop idle (pooled) client connections quickly instead of waiting 30 s.
    closeTimeout: 200,
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push(toStored(nextId++, parsed, session.envelope.rcptTo.map((r) => r.address)));
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(opts.smtpPort ?? 1025, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const app = express();
  app.get("/api/messages", (req, res) => {
    const to = typeof req.query.to === "string" ? req.query.to.toLowerCase() : null;
    const list = messages.filter((m) => !to || m.to.some((t) => t.toLowerCase() === to)).map(summary).reverse();
    res.json({ messages: list });
  });
  app.get("/api/messages/:id", (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    if (!m) return res.status(404).json({ error: { code: "not_found", message: "No such message." } });
    res.json({ message: summary(m) });
  });
  app.get("/api/messages/:id/attachments/:index", (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    const a = m?.attachments[Number(req.params.index)];
    if (!a) return res.status(404).json({ error: { code: "not_found", message: "No such attachment." } });
    res.type(a.contentType).set("Content-Disposition", `inline; filename="${a.filename.replace(/"/g, "")}"`).send(a.content);
  });
  app.delete("/api/messages", (_req, res) => {
    messages.length = 0;
    res.status(204).end();
  });
  app.get("/messages/:id/html", (req, res) => {
    const m = messages.find((x) => x.id === Number(req.params.id));
    if (!m) return res.status(404).send("No such message.");
    res.type("html").send(m.html ?? `<pre>${esc(m.text)}</pre>`);
  });
  app.get("/", (_req, res) => {
    const rows = [...messages].reverse().map((m) => `<tr><td>${esc(m.date.replace("T", " ").slice(0, 19))}</td><td>${esc(m.to.join(", "))}</td>
      <td><a href="/messages/${m.id}/html">${esc(m.subject || "(no subject)")}</a></td>
      <td>${m.attachments.map((a, i) => `<a href="/api/messages/${m.id}/attachments/${i}">${esc(a.filename)}</a>`).join(" ")}</td></tr>`).join("");
    res.type("html").send(`<!doctype html><meta charset="utf-8"><title>Panwise mail fake</title>
<style>body{font-family:sans-serif;margin:24px;color:#222}table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #ddd;padding:8px;text-align:left}</style>
<h1>Mail fake inbox</h1><p>${messages.length} message(s) received on SMTP port ${smtpPort}. Nothing here leaves this machine.</p>
<table><tr><th>Received (UTC)</th><th>To</th><th>Subject</th><th>Attachments</th></tr>${rows || '<tr><td colspan="4">No mail yet.</td></tr>'}</table>`);
  });
  const httpServer = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    httpServer.once("error", reject);
    httpServer.listen(opts.httpPort ?? 8025, host, () => resolve());
  });
  const httpPort = (httpServer.address() as AddressInfo).port;
  let closing: Promise<void> | null = null;

  return {
    smtpPort,
    httpPort,
    messages,
    clear: () => void (messages.length = 0),
    close: () =>
      (closing ??= new Promise<void>((resolve) => {
        httpServer.closeAllConnections?.();
        httpServer.close(() => smtp.close(() => resolve()));
      })),
  };
}
