import "reflect-metadata";
import { createDataSource } from "./db/data-source";
import { isEmpty, seedDemo } from "./seed/demo";

/**
 * Command line: `node --import tsx server/cli.ts <command>`
 *   migrate   run pending migrations
 *   seed      add the demo scenario (idempotent)
 *   setup     migrate, then seed when the database is empty (what npm start does)
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
        } else {
          console.log("database ready");
        }
        break;
      }
      default:
        console.error("usage: cli.ts migrate | seed | setup");
        process.exitCode = 2;
    }
  } finally {
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
