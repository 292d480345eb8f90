import "reflect-metadata";
import type { Server } from "node:http";
import { buildContext } from "./context";
import { loadServerConfig } from "./config";
import { createApp } from "./app";
import { startScheduler } from "./jobs/scheduler";
import { jobs } from "./jobs";

/** The server process: connect, listen, run the scheduled jobs, and stop cleanly on SIGINT/SIGTERM. */
async function main() {
  // Every setting checked before anything starts: one message naming every variable to fix.
  const ctx = buildContext({ config: loadServerConfig() });
  const { logger, config } = ctx;
  await ctx.dataSource.initialize();
  const pending = await ctx.dataSource.showMigrations();
  if (pending) logger.warn("there are migrations not yet run: run `npm run migration:run` (npm start does it)");
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.port, config.host, (err?: Error) => (err ? reject(err) : resolve(s)));
  }).catch((err: NodeJS.ErrnoException) => {
    logger.fatal({ code: err.code }, err.code === "EADDRINUSE" ? `port ${config.port} on ${config.host} is already in use` : `cannot listen: ${err.message}`);
    process.exit(2);
  }) as Server;
  const scheduler = process.env.PANWISE_NO_JOBS ? null : startScheduler(ctx, jobs);
  if (scheduler) ctx.kickOutbox = () => scheduler.trigger("send-mail");
  logger.info({ url: `http://${config.host}:${config.port}` }, "Panwise server listening");

  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "shutting down");
    const force = setTimeout(() => process.exit(1), 10000);
    force.unref();
    server.close();
    server.closeIdleConnections?.();
    await scheduler?.stop();
    await ctx.dataSource.destroy().catch(() => undefined);
    ctx.mailer.close();
    process.exit(0);
  };
  process.on("SIGINT", () => void shutdown("SIGINT"));
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
}

main().catch((err) => {
  // One line that says what is wrong (e.g. the Stripe settings), not a stack trace.
  const message = err instanceof Error ? err.message : String(err);
  const line = `Panwise server did not start: ${message}`;
  console.error(process.env.LOG_PRETTY === "1" ? line : JSON.stringify({ level: 60, time: Date.now(), msg: line }));
  process.exit(1);
});
