import nodemailer from "nodemailer";
import type { Logger } from "../logger";

export interface OutgoingMail {
  to: string;
  subject: string;
  html: string;
  text: string;
  /** Display name of the sender: the bakery's name. */
  fromName: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
  /** A fixed Message-ID (the outbox sets one per mail, so a retry is the same message). */
  messageId?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
  close(): void;
}

/** nodemailer over SMTP_URL. Logs say who and what, never the body (links carry tokens). */
export function createSmtpMailer(smtpUrl: string, fromAddress: string, logger: Logger): Mailer {
  // A small connection pool: one SMTP session carries many mails instead of a handshake per mail.
  // (nodemailer reads transport options from the URL's query string.)
  const url = new URL(smtpUrl);
  if (!url.searchParams.has("pool")) url.searchParams.set("pool", "true");
  if (!url.searchParams.has("maxConnections")) url.searchParams.set("maxConnections", "3");
  const transport = nodemailer.createTransport(url.toString());
  return {
    async send(mail) {
      const info = await transport.sendMail({
        from: { name: mail.fromName, address: fromAddress },
        to: mail.to,
        subject: mail.subject,
        html: mail.html,
        text: mail.text,
        attachments: mail.attachments,
        messageId: mail.messageId,
      });
      logger.info({ mail: { to: mail.to, subject: mail.subject, messageId: info.messageId } }, "mail sent");
      return { messageId: info.messageId };
    },
    close() {
      transport.close();
    },
  };
}
