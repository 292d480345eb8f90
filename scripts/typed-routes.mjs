// npm run typecheck runs this first: Expo Router's route types (.expo/types/router.d.ts) from app/, then tsc checks links.
import { ensureNodeModules } from "./lib/deps.mjs";
import { generateTypedRoutes } from "./lib/typed-routes.mjs";
import { StartupError, warn } from "./lib/env.mjs";

try {
  ensureNodeModules();
  generateTypedRoutes();
} catch (err) {
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  process.exit(1);
}
