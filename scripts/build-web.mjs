// npm run build:web — export the web app now (use --force to rebuild even when nothing changed).
import { ensureNodeModules } from "./lib/deps.mjs";
import { ensureWebBuild } from "./lib/web-build.mjs";
import { StartupError, warn } from "./lib/env.mjs";

try {
  ensureNodeModules();
  await ensureWebBuild({ force: process.argv.includes("--force") });
} catch (err) {
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  process.exit(1);
}
