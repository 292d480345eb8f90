import { useQuery } from "@tanstack/react-query";
import { api } from "./client";
import { bakeryKeys } from "./keys";
import type { BakeryDto } from "../../shared/schemas/bakery";
import { formatterFor, type Formatter } from "../../shared/format";
import { setDisplayLocale } from "../format";

export { bakeryKeys } from "./keys";

export const bakeryApi = {
  get: () =>
    api<{ bakery: BakeryDto }>("/api/bakery").then((r) => {
      setDisplayLocale(r.bakery.locale);
      return r.bakery;
    }),
};

export function useBakeryQuery() {
  const q = useQuery({ queryKey: bakeryKeys.detail(), queryFn: bakeryApi.get });
  if (q.data) setDisplayLocale(q.data.locale);
  return q;
}

/** The bakery's time zone once known (dates and times are shown in it); undefined while loading. */
export function useBakeryTimeZone(): string | undefined {
  return useBakeryQuery().data?.timeZone;
}

/**
 * Formatters in the bakery's locale and zone (shared/format.ts), en-US until the bakery has loaded. Reads the
 * cached bakery without fetching it, and redraws the component when the bakery (its locale) arrives or changes.
 */
export function useFormat(): Formatter {
  const { data } = useQuery({ queryKey: bakeryKeys.detail(), queryFn: bakeryApi.get, enabled: false });
  if (data) setDisplayLocale(data.locale);
  return formatterFor(data?.locale, data?.timeZone);
}
