import fs from "node:fs";
import type { Page } from "playwright-core";
import { BASE_URL, DESKTOP, PHONE, close, launch, newPage, signIn } from "./browser";

/**
 * Every screen of every role, at 390 × 844 and 1280 × 800, checked by axe-core (Deque's accessibility engine,
 * the npm package `axe-core`, its WCAG 2.0/2.1/2.2 A and AA rules and best practices) running in the same
 * Chromium: no violation of the "serious" or "critical" impact levels (axe-core's own impact scale). Issue 12, checks.
 *
 * axe is evaluated through the DevTools protocol (Playwright's evaluate), which the app's CSP (script-src 'self')
 * does not apply to; nothing is added to the page itself.
 */
jest.setTimeout(900_000);
beforeAll(() => launch());
afterAll(() => close());

const AXE_SOURCE = fs.readFileSync(require.resolve("axe-core/axe.min.js"), "utf8");

interface Violation { id: string; impact: string | null; help: string; nodes: { target: string[]; failureSummary?: string }[] }

async function api<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (p) => {
    const session = JSON.parse(localStorage.getItem("panwise.session.v1") ?? "{}") as { token?: string };
    const res = await fetch(p, { headers: { Authorization: `Bearer ${session.token}` } });
    return res.json();
  }, path) as Promise<T>;
}

/** The first id of the first list in an API answer ({ invoices: [...] } → invoices[0].id), or null. */
async function firstId(page: Page, path: string): Promise<number | null> {
  const body = await api<Record<string, unknown>>(page, path);
  const list = Object.values(body).find(Array.isArray) as { id: number }[] | undefined;
  return list?.[0]?.id ?? null;
}

async function settle(page: Page) {
  await page.waitForLoadState("networkidle").catch(() => undefined);
  // Lists draw after their query answers; wait until no loading state is left (at most 5 s).
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"][role="progressbar"], [data-testid="query-loading"]'), undefined, { timeout: 5000 }).catch(() => undefined);
  await page.waitForTimeout(150);
}

async function axe(page: Page): Promise<Violation[]> {
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe !== "undefined");
  if (!loaded) await page.evaluate(AXE_SOURCE);
  const result = await page.evaluate(async () => {
    const a = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: Violation[] }> } }).axe;
    return a.run(document, { resultTypes: ["violations"] });
  });
  return result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
}

const describeViolations = (path: string, vs: Violation[]) =>
  vs.map((v) => `${path}: [${v.impact}] ${v.id} — ${v.help}\n${v.nodes.slice(0, 4).map((n) => `    ${n.target.join(" ")}: ${(n.failureSummary ?? "").split("\n").slice(1, 3).join(" ")}`).join("\n")}`);

/** The screens a role opens, with detail screens resolved through the API. */
async function screensFor(page: Page, role: "buyer" | "baker" | "owner" | "bookkeeper"): Promise<string[]> {
  const withId = async (list: string, make: (id: number) => string[]) => {
    const id = await firstId(page, list);
    return id === null ? [] : make(id);
  };
  if (role === "buyer") {
    const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
    const cal = await api<{ days?: { date: string; orderable: boolean }[] }>(page, `/api/calendar?from=${day(0)}&to=${day(20)}`);
    const open = cal.days?.find((d) => d.orderable)?.date;
    return ["/buyer", ...(open ? [`/buyer/order/${open}`] : []), "/buyer/standing", "/buyer/orders", "/buyer/invoices",
      ...(await withId("/api/invoices", (id) => [`/buyer/invoices/${id}`])), "/buyer/account", "/buyer/me"];
  }
  if (role === "baker") {
    return ["/bake", "/bake/day", "/bake/orders", "/bake/formulas", ...(await withId("/api/formulas", (id) => [`/bake/formulas/${id}`])), "/bake/formulas/new",
      "/bake/forecast", "/bake/ingredients", ...(await withId("/api/ingredients", (id) => [`/bake/ingredients/${id}`])), "/bake/ingredients/new", "/bake/more", "/bake/me"];
  }
  const money = ["/office/money", "/office/money/aging", "/office/money/exports", "/office/money/payouts",
    ...(await withId("/api/payouts", (id) => [`/office/money/payouts/${id}`])), "/office/money/settings"];
  const shared = ["/office", "/office/orders", "/office/invoices", ...(await withId("/api/invoices", (id) => [`/office/invoices/${id}`])),
    "/office/accounts", ...(await withId("/api/accounts", (id) => [`/office/accounts/${id}`])), ...money, "/office/outbox", "/office/more", "/office/me"];
  if (role === "bookkeeper") return shared;
  return [...shared, "/office/dispatch", ...(await withId("/api/accounts", (id) => [`/office/accounts/${id}/edit`, `/office/accounts/${id}/order`])), "/office/accounts/new",
    "/office/products", ...(await withId("/api/products?all=1", (id) => [`/office/products/${id}`])), "/office/products/new",
    "/office/production", "/office/production/day", "/office/production/forecast", "/office/production/formulas",
    ...(await withId("/api/formulas", (id) => [`/office/production/formulas/${id}`])), "/office/production/formulas/new",
    "/office/production/ingredients", ...(await withId("/api/ingredients", (id) => [`/office/production/ingredients/${id}`])), "/office/production/ingredients/new",
    "/office/production/settings", "/office/people", "/office/people/invite", "/office/price-lists",
    ...(await withId("/api/price-lists", (id) => [`/office/price-lists/${id}`])), "/office/price-lists/new", "/office/calendar"];
}

const ROLES = [
  { role: "buyer", email: "buyer@tidewater.test" },
  { role: "baker", email: "baker@hollowbrook.test" },
  { role: "owner", email: "owner@hollowbrook.test" },
  { role: "bookkeeper", email: "books@hollowbrook.test" },
] as const;

describe.each([["phone", PHONE], ["desktop", DESKTOP]] as const)("axe at %s width", (_name, viewport) => {
  it("the signed-out screens have no serious or critical violations", async () => {
    const { context, page } = await newPage(viewport);
    const found: string[] = [];
    for (const path of ["/sign-in", "/forgot-password", "/set-password?token=not-a-real-token"]) {
      await page.goto(`${BASE_URL}${path}`);
      await settle(page);
      found.push(...describeViolations(path, await axe(page)));
    }
    await context.close();
    expect(found).toEqual([]);
  });

  it.each(ROLES)("every screen the $role opens has no serious or critical violations", async ({ role, email }) => {
    const { context, page } = await newPage(viewport);
    await signIn(page, email);
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
    await settle(page);
    const screens = await screensFor(page, role);
    expect(screens.length).toBeGreaterThan(5);
    const found: string[] = [];
    const visited: string[] = [];
    for (const path of screens) {
      await page.goto(`${BASE_URL}${path}`);
      await settle(page);
      visited.push(new URL(page.url()).pathname);
      found.push(...describeViolations(path, await axe(page)));
    }
    await context.close();
    // Each screen opened as itself (no role redirect hid one from the check).
    expect({ visited, found }).toEqual({ visited: screens.map((s) => s.split("?")[0]), found: [] });
  });
});
