import type { Href } from "expo-router";

/** A link as a string path: one of the app's routes (typed routes, .expo/types/router.d.ts), with its query if any. */
export type RoutePath = Extract<Href, string>;

/** Search params can arrive as arrays; screens want one string. */
export function firstParam(value: string | string[] | undefined): string | undefined {
  if (Array.isArray(value)) return value[0];
  return value === "" ? undefined : value;
}

/** A positive whole number from a route param, or NaN. */
export function idParam(value: string | string[] | undefined): number {
  const raw = firstParam(value);
  if (!raw || !/^\d+$/.test(raw)) return Number.NaN;
  return Number(raw);
}
