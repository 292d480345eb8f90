// npm run migration:generate -- Name
// Generates a migration with the TypeORM CLI against a scratch database that has every existing
// migration applied, so the new file holds exactly the difference from the entities.
import { ensureMariadb, ensureAppUser, createDatabase, dropDatabases } from "./lib/mariadb.mjs";
import { ensureNodeModules } from "./lib/deps.mjs";
import { ROOT, capture, fail, log, warn } from "./lib/env.mjs";

const name = process.argv[2];
if (!name || !/^[A-Za-z][A-Za-z0-9]*$/.test(name)) {
  warn("usage: npm run migration:generate -- MigrationName   (letters and digits)");
  process.exit(2);
}
ensureNodeModules();
const db = await ensureMariadb();
try {
  ensureAppUser();
  const scratch = "panwise_migration_scratch";
  dropDatabases(scratch);
  createDatabase(scratch);
  const env = { ...process.env, DB_NAME: scratch };
  const tsx = ["--import", "tsx"];
  const migrate = capture("node", [...tsx, "server/cli.ts", "migrate"], { env, stdio: "inherit" });
  if (migrate.status !== 0) fail("running the existing migrations failed");
  const gen = capture("node", [...tsx, "node_modules/typeorm/cli.js", "migration:generate", "-d", "server/db/data-source.ts", `server/db/migrations/${name}`], { env, cwd: ROOT });
  process.stdout.write(gen.stdout);
  process.stderr.write(gen.stderr);
  dropDatabases(scratch);
  if (gen.status !== 0) {
    log("no migration written (the entities match the migrations, or the CLI failed: see above)");
    process.exitCode = 1;
  }
} finally {
  await db.stop();
}
