// npm run db — start only the private MariaDB (with the app's user and database) and keep it running
// until Ctrl-C; handy while running single test files with npx jest.
import { StartupError, log, warn } from "./lib/env.mjs";
import { ensureDebPackages } from "./lib/deps.mjs";
import { createDatabase, dbSettings, ensureAppUser, ensureMariadb } from "./lib/mariadb.mjs";

try {
  ensureDebPackages(["mariadb-server", "mariadb-client"]);
  const db = await ensureMariadb();
  ensureAppUser();
  createDatabase(dbSettings().database);
  if (!db.startedHere) {
    log("MariaDB was already running; leaving it as it is.");
    process.exit(0);
  }
  log(`MariaDB on 127.0.0.1:${dbSettings().port}; Ctrl-C stops it.`);
  const stop = async () => { await db.stop(); process.exit(0); };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  setInterval(() => {}, 1 << 30);
} catch (err) {
  warn(err instanceof StartupError ? err.message : String(err));
  process.exit(1);
}
