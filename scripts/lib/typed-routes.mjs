// Typed routes: Expo Router's declaration of every route (.expo/types/router.d.ts, plus expo-env.d.ts),
// so that tsc checks every href, router.push and <Redirect>. The dev server writes it as files change;
// `expo customize tsconfig.json` is Expo CLI's way to write it without a server (offline, ~2 s).
import fs from "node:fs";
import path from "node:path";
import { ROOT, capture, fail, log } from "./env.mjs";

export const ROUTER_TYPES = path.join(ROOT, ".expo", "types", "router.d.ts");

/** Writes the route types afresh from app/; stops with a clear message when Expo CLI could not. */
export function generateTypedRoutes({ quiet = false } = {}) {
  // Removed first, so a failed run can never leave an older list of routes for tsc to accept.
  fs.rmSync(ROUTER_TYPES, { force: true });
  const res = capture("npx", ["expo", "customize", "tsconfig.json"], {
    env: { ...process.env, EXPO_OFFLINE: "1", EXPO_NO_TELEMETRY: "1", CI: "1" },
  });
  const text = fs.existsSync(ROUTER_TYPES) ? fs.readFileSync(ROUTER_TYPES, "utf8") : "";
  if (res.status !== 0 || !text.includes("declare module 'expo-router'")) {
    fail(`could not write the typed routes (${path.relative(ROOT, ROUTER_TYPES)}) with \`npx expo customize tsconfig.json\`:\n${res.stdout}${res.stderr}`);
  }
  if (!quiet) log(`typed routes written (${path.relative(ROOT, ROUTER_TYPES)})`);
}
