import { useBakeryQuery } from "../api/bakery";
import { formatMoney } from "../../shared/money";
import { localeOr } from "../../shared/format";

/** Money in the bakery's currency and locale. */
export function useMoney(): (cents: number) => string {
  const bakery = useBakeryQuery().data;
  const currency = bakery?.currency ?? "USD";
  const locale = localeOr(bakery?.locale);
  return (cents: number) => formatMoney(cents, currency, locale);
}
