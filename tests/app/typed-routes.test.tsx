import React from "react";
import fs from "node:fs";
import path from "node:path";
import { Link, router, type Href } from "expo-router";

/**
 * Typed routes (app.json experiments.typedRoutes): Expo CLI writes every route of app/ into
 * .expo/types/router.d.ts (scripts/lib/typed-routes.mjs, before the type check), and tsc then checks
 * every href, router.push and <Redirect>. This function is never called: tsc reads it, and each
 * @ts-expect-error fails the type check the day a wrong link is accepted.
 */
function compileOnlyChecks() {
  const accepted: Href[] = [
    "/office/invoices?accountId=12",
    `/office/money/payouts/${"po_1"}`,
    { pathname: "/office/accounts/[id]", params: { id: 11 } },
  ];
  // @ts-expect-error -- there is no route /office/no-such-page
  const missing: Href = "/office/no-such-page";
  // @ts-expect-error -- a typo: the route is /bake/formulas
  router.push("/bake/formula");
  // @ts-expect-error -- a dynamic route needs its params
  router.replace({ pathname: "/buyer/invoices/[id]" });
  const link = (
    // @ts-expect-error -- a link to a page that does not exist
    <Link href="/buyer/invoice">Invoices</Link>
  );
  return { accepted, missing, link };
}
void compileOnlyChecks;

const ROOT = path.join(__dirname, "..", "..");
const APP = path.join(ROOT, "app");
const ROUTER_TYPES = path.join(ROOT, ".expo", "types", "router.d.ts");

/** The URL path of each route file (layouts are not routes), as Expo Router names it: groups and "index" left out. */
function routesOfApp(dir = APP): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const abs = path.join(dir, entry.name);
    if (entry.isDirectory()) return routesOfApp(abs);
    if (!/\.tsx?$/.test(entry.name) || /^_layout\./.test(entry.name)) return [];
    const segments = path
      .relative(APP, abs)
      .replace(/\.tsx?$/, "")
      .split(path.sep)
      .filter((s) => !/^\(.+\)$/.test(s));
    if (segments.at(-1) === "index") segments.pop();
    return [`/${segments.join("/")}`];
  });
}

/** The paths the generated declaration accepts as a pathname, without their group prefixes. */
function routesOfTypes(text: string): string[] {
  const line = text.split("\n").find((l) => l.trim().startsWith("hrefInputParams:")) ?? "";
  const literals = [...line.matchAll(/`(\/[^`$]*)`/g)].map((m) => m[1]);
  return [...new Set(literals)].filter((p) => p !== "/_sitemap");
}

describe("typed routes", () => {
  it("are current: the generated route types list exactly the routes of app/", () => {
    if (!fs.existsSync(ROUTER_TYPES)) {
      throw new Error("No .expo/types/router.d.ts: run `npm run typecheck` (or node scripts/typed-routes.mjs) to write it");
    }
    expect(routesOfTypes(fs.readFileSync(ROUTER_TYPES, "utf8")).sort()).toEqual(routesOfApp().sort());
  });
});
