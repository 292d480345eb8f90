/**
 * Money is integer minor units everywhere. ISO 4217 gives each currency's minor-unit exponent
 * (USD, EUR, GBP, CAD: 2; JPY: 0; KWD, BHD: 3).
 */
const MINOR_UNITS: Record<string, number> = { USD: 2, EUR: 2, GBP: 2, CAD: 2, AUD: 2, JPY: 0, KWD: 3, BHD: 3 };

export function minorUnitExponent(currency: string): number {
  return MINOR_UNITS[currency.toUpperCase()] ?? 2;
}

const moneyFormats = new Map<string, Intl.NumberFormat>();
/** An amount for a person, in the bakery's locale (shared/format.ts passes it): "$12.50" in en-US, "US$12.50" in en-GB. */
export function formatMoney(minor: number, currency = "USD", locale = "en-US"): string {
  const exp = minorUnitExponent(currency);
  const key = `${locale}|${currency}`;
  let f = moneyFormats.get(key);
  if (!f) moneyFormats.set(key, (f = new Intl.NumberFormat(locale, { style: "currency", currency, minimumFractionDigits: exp, maximumFractionDigits: exp })));
  return f.format(minor / 10 ** exp).replace(/\u202f/g, " ");
}

/** "12.50" → 1250 for USD; null when it is not an amount with at most the currency's decimals. */
export function parseMoney(text: string, currency = "USD"): number | null {
  const exp = minorUnitExponent(currency);
  const t = text.trim().replace(/^\$/, "").replace(/,/g, "");
  const re = exp === 0 ? /^\d+$/ : new RegExp(`^\\d+(\\.\\d{1,${exp}})?$`);
  if (!re.test(t)) return null;
  const [whole, frac = ""] = t.split(".");
  return Number(whole) * 10 ** exp + Number((frac + "0".repeat(exp)).slice(0, exp) || "0");
}

/** Decimal text for exports: 1250 → "12.50". */
export function toDecimal(minor: number, currency = "USD"): string {
  const exp = minorUnitExponent(currency);
  const sign = minor < 0 ? "-" : "";
  const abs = Math.abs(minor);
  if (exp === 0) return `${sign}${abs}`;
  return `${sign}${Math.floor(abs / 10 ** exp)}.${String(abs % 10 ** exp).padStart(exp, "0")}`;
}

/** A percentage off a price, rounded half up to the nearest minor unit. */
export function applyPercentOff(priceMinor: number, percentOff: number): number {
  return Math.round((priceMinor * (100 - percentOff)) / 100 + Number.EPSILON);
}
