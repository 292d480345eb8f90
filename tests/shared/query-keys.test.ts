/**
 * Every React Query key is built by a factory in components/api/keys.ts (issue 11 "Query keys"): no key is
 * written out as an array literal, so every invalidation is found by the factory's name, and each factory's keys
 * stay under its own root. Matching is React Query's own (`partialMatchKey`, what `invalidateQueries` uses).
 */
import fs from "node:fs";
import path from "node:path";
import { partialMatchKey } from "@tanstack/query-core";
import * as keys from "../../components/api/keys";

const ROOT = path.join(__dirname, "..", "..");
const KEYS_FILE = path.join("components", "api", "keys.ts");

function sources(dir: string): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...sources(rel));
    else if (/\.(ts|tsx)$/.test(e.name) && !e.name.endsWith(".d.ts")) out.push(rel);
  }
  return out;
}

/** A key given as an array literal (`queryKey: [`, `setQueryData([`…), spread or not: it must come from a factory. */
const LITERAL_KEY = /\b(?:queryKey|mutationKey)\s*:\s*\[|\b(?:setQueryData|getQueryData|setQueriesData|getQueriesData|invalidateQueries|refetchQueries|removeQueries|resetQueries|cancelQueries|fetchQuery|prefetchQuery|ensureQueryData)\s*(?:<[^>]*>)?\s*\(\s*\[/g;
/** A key factory defined outside keys.ts (`export const thingKeys = {`). */
const FACTORY = /\b(?:const|let|var)\s+\w+Keys\s*=\s*\{/g;

function findAll(re: RegExp, files: string[]): string[] {
  const hits: string[] = [];
  for (const file of files) {
    const text = fs.readFileSync(path.join(ROOT, file), "utf8");
    for (const m of text.matchAll(re)) hits.push(`${file}:${text.slice(0, m.index).split("\n").length}: ${m[0]}`);
  }
  return hits;
}

const FILES = [...sources("components"), ...sources("app")];

type Factory = Record<string, unknown> & { all: readonly unknown[] };
const FACTORIES = Object.entries(keys.ALL_KEY_FACTORIES) as [string, Factory][];

/** Every key a factory makes, from sample arguments (defaults first; an object for the ones that need params). */
function keysOf(f: Factory): { name: string; key: readonly unknown[] }[] {
  const out: { name: string; key: readonly unknown[] }[] = [{ name: "all", key: f.all }];
  for (const [name, fn] of Object.entries(f)) {
    if (typeof fn !== "function") continue;
    let key: readonly unknown[];
    try {
      key = fn();
    } catch {
      key = fn({ from: "2026-01-05", to: "2026-01-11" });
    }
    out.push({ name, key });
  }
  return out;
}

describe("query keys", () => {
  it("the literal-key check finds what it must (so an empty result means something)", () => {
    const sample = `qc.invalidateQueries({ queryKey: ["orders"] });\nqc.setQueryData<Plan>([...productionKeys.all, "forecast"], x);\nuseQuery({ queryKey: orderKeys.list(p) });`;
    expect([...sample.matchAll(LITERAL_KEY)].map((m) => m[0])).toEqual(["queryKey: [", "setQueryData<Plan>(["]);
    expect([..."export const thingKeys = {".matchAll(FACTORY)]).toHaveLength(1);
  });

  it("no key in components/ or app/ is an array literal: every key comes from a factory in components/api/keys.ts", () => {
    expect(FILES.length).toBeGreaterThan(50);
    expect(findAll(LITERAL_KEY, FILES.filter((f) => f !== KEYS_FILE))).toEqual([]);
  });

  it("every key factory is defined in components/api/keys.ts and listed in ALL_KEY_FACTORIES", () => {
    expect(findAll(FACTORY, FILES.filter((f) => f !== KEYS_FILE))).toEqual([]);
    const defined = [...fs.readFileSync(path.join(ROOT, KEYS_FILE), "utf8").matchAll(/export const (\w+Keys) = \{/g)].map((m) => m[1]);
    expect(defined.length).toBeGreaterThan(20);
    expect(Object.keys(keys.ALL_KEY_FACTORIES).sort()).toEqual([...defined].sort());
  });

  it("each factory has its own one-word root, and no other factory's key falls under it", () => {
    const roots = FACTORIES.map(([, f]) => f.all);
    for (const r of roots) expect(r).toEqual([expect.any(String)]);
    expect(new Set(roots.map((r) => r[0])).size).toBe(roots.length);
    for (const [name, f] of FACTORIES) {
      for (const [other, g] of FACTORIES) {
        if (other === name) continue;
        for (const k of keysOf(g)) expect({ factory: name, under: partialMatchKey(k.key, f.all) }).toEqual({ factory: name, under: false });
      }
    }
  });

  it("every key a factory makes starts with its root, so invalidating `all` reaches it", () => {
    for (const [name, f] of FACTORIES) {
      for (const k of keysOf(f)) expect({ key: `${name}.${k.name}`, underRoot: partialMatchKey(k.key, f.all) }).toEqual({ key: `${name}.${k.name}`, underRoot: true });
    }
  });

  it("the group keys reach their members and nothing beside them", () => {
    const { accountKeys, orderKeys, productKeys, productionKeys, formulaKeys, invoiceKeys, userKeys } = keys;
    const under = (key: readonly unknown[], prefix: readonly unknown[]) => partialMatchKey(key, prefix);
    expect(under(accountKeys.list({ q: "pier" }), accountKeys.lists())).toBe(true);
    expect(under(accountKeys.detail(3), accountKeys.lists())).toBe(false);
    expect(under(accountKeys.detail(3), accountKeys.details())).toBe(true);
    expect(under(orderKeys.list({ status: "open" }), orderKeys.lists())).toBe(true);
    expect(under(orderKeys.detail(9), orderKeys.lists())).toBe(false);
    expect(under(productKeys.list({ all: true }), productKeys.lists())).toBe(true);
    expect(under(userKeys.list({ q: "ann" }), userKeys.lists())).toBe(true);
    expect(under(userKeys.detail(2), userKeys.lists())).toBe(false);
    expect(under(invoiceKeys.list({ overdue: true }), invoiceKeys.lists())).toBe(true);
    expect(under(formulaKeys.detail(4, 2), formulaKeys.details())).toBe(true);
    expect(under(formulaKeys.history(4), formulaKeys.details())).toBe(false);
    // A recalculated plan refreshes every forecast but no other plan, nor the settings.
    expect(under(productionKeys.forecast("2026-01-05"), productionKeys.forecasts())).toBe(true);
    expect(under(productionKeys.plan("2026-01-05"), productionKeys.forecasts())).toBe(false);
    expect(under(productionKeys.settings(), productionKeys.forecasts())).toBe(false);
    expect(under(productionKeys.plan("2026-01-05"), productionKeys.plans())).toBe(true);
    expect(under(productionKeys.nextDay(), productionKeys.plans())).toBe(false);
  });

  it("keys that differ in their parameters are different keys, and the same parameters make the same key", () => {
    const { orderKeys, calendarKeys, feedKeys } = keys;
    expect(orderKeys.list({ from: "2026-01-05" })).not.toEqual(orderKeys.list({ from: "2026-01-06" }));
    expect(orderKeys.list({})).toEqual(orderKeys.list());
    expect(calendarKeys.days({ from: "2026-01-05", to: "2026-01-11" })).toEqual(calendarKeys.days({ from: "2026-01-05", to: "2026-01-11", accountId: undefined }));
    expect(feedKeys.detail()).toEqual(feedKeys.detail(0));
    expect(feedKeys.detail(3)).not.toEqual(feedKeys.detail());
  });
});
