import { startMailFake } from "./mail-fake";

/** `node --import tsx fakes/mail/main.ts` — SMTP on MAIL_SMTP_PORT (1025), inbox on MAIL_HTTP_PORT (8025). */
const smtpPort = Number(process.env.MAIL_SMTP_PORT || 1025);
const httpPort = Number(process.env.MAIL_HTTP_PORT || 8025);

startMailFake({ smtpPort, httpPort })
  .then((fake) => {
    console.log(`mail fake: SMTP on 127.0.0.1:${fake.smtpPort}, inbox on http://127.0.0.1:${fake.httpPort}`);
    const stop = () => fake.close().then(() => process.exit(0));
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  })
  .catch((err: NodeJS.ErrnoException) => {
    console.error(err.code === "EADDRINUSE" ? `mail fake: port busy (${err.message}); set MAIL_SMTP_PORT / MAIL_HTTP_PORT` : `mail fake failed: ${err.message}`);
    process.exit(2);
  });
