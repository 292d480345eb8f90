import "reflect-metadata";
import { createDataSource } from "./db/data-source";
import { isEmpty, seedDemo } from "./seed/demo";
import { buildContext } from "./context";
import { materialiseAll } from "./orders/standing.service";
import { seedHistory } from "./seed/history";
import { payByCardThroughStripe, seedBilling } from "./seed/billing";

/**
 * Command line: `node --import tsx server/cli.ts <command>`
 *   migrate   run pending migrations
 *   seed      add the demo scenario (idempotent)
 *   setup     migrate, then seed when the database is empty, then make standing orders (what npm start does)
 *   standing  turn standing orders into orders for every orderable date within the horizon
 */
async function main() {
  const [command] = process.argv.slice(2);
  const ds = createDataSource();
  await ds.initialize();
  try {
    switch (command) {
      case "migrate": {
        const ran = await ds.runMigrations({ transaction: "each" });
        console.log(ran.length ? `ran ${ran.length} migration(s): ${ran.map((m) => m.name).join(", ")}` : "migrations: up to date");
        break;
      }
      case "seed": {
        const { created } = await seedDemo(ds);
        console.log(`demo data: ${created} row(s) added`);
        break;
      }
      case "setup": {
        const ran = await ds.runMigrations({ transaction: "each" });
        if (ran.length) console.log(`ran ${ran.length} migration(s)`);
        if (await isEmpty(ds)) {
          const { created } = await seedDemo(ds);
          console.log(`seeded the Hollowbrook Bakehouse demo (${created} rows)`);
          const ctx = buildContext({ dataSource: ds });
          console.log(`demo history: ${await seedHistory(ctx)} past or locked order(s)`);
          const billing = await seedBilling(ctx, payByCardThroughStripe);
          console.log(`demo billing: ${billing.invoices} invoice(s), ${billing.payments} payment(s)`);
          const payout = await fetch(`${ctx.config.stripe.protocol}://${ctx.config.stripe.host}:${ctx.config.stripe.port}/_fake/payouts/run`, { method: "POST" }).then((r) => r.json() as Promise<{ payout: { id: string } | null }>).catch(() => null);
          if (payout?.payout) console.log(`demo payout on the Stripe fake: ${payout.payout.id}`);
          ctx.mailer.close();
        } else {
          console.log("database ready");
        }
        await standingOrders(ds);
        break;
      }
      case "standing":
        await standingOrders(ds);
        break;
      default:
        console.error("usage: cli.ts migrate | seed | setup");
        process.exitCode = 2;
    }
  } finally {
    await ds.destroy();
  }
}

async function standingOrders(ds: import("typeorm").DataSource) {
  const ctx = buildContext({ dataSource: ds });
  try {
    const r = await materialiseAll(ctx);
    console.log(`standing orders: ${r.created} order(s) made, ${r.updated} brought up to date, ${r.cancelled} withdrawn`);
  } finally {
    ctx.mailer.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
