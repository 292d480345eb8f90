import { z } from "zod";
import { readText } from "../../forms/textSchemas";
import type { BillingSettingsDto } from "../../api/billingSettings";
import { parseMoney } from "../../../shared/money";
import { percent } from "./parts";

/** The billing settings form's inputs, as typed. */
export interface BillingSettingsValues {
  taxPercent: string;
  invoicePrefix: string;
  creditHoldDays: string;
  paymentInstructions: string;
}

/** The names the server gives the settings (errors go beside the inputs under these names). */
export const BILLING_SETTINGS_FIELDS = ["salesTaxRateBp", "invoicePrefix", "creditHoldDays", "paymentInstructions"] as const;

/** "8.75" (percent, up to two decimals) → 875 basis points. */
export function percentToBp(text: string): number | null {
  const t = text.trim().replace(/\s*%$/, "");
  if (!/^\d{1,3}(\.\d{1,2})?$/.test(t)) return null;
  return parseMoney(t, "USD");
}

export function bpToPercentText(bp: number): string {
  return percent(bp).replace(" %", "");
}

export function billingSettingsValues(s: BillingSettingsDto): BillingSettingsValues {
  return { taxPercent: bpToPercentText(s.salesTaxRateBp), invoicePrefix: s.invoicePrefix, creditHoldDays: String(s.creditHoldDays), paymentInstructions: s.paymentInstructions };
}

/** The form's text values under the server's names, for `billingSettingsSchema`. */
export function billingSettingsInput(v: BillingSettingsValues) {
  return { salesTaxRateBp: v.taxPercent, invoicePrefix: v.invoicePrefix, creditHoldDays: v.creditHoldDays, paymentInstructions: v.paymentInstructions };
}

/** The settings checked before saving (the server checks the same again). */
export const billingSettingsSchema: z.ZodType<Omit<BillingSettingsDto, "remindersOn">, ReturnType<typeof billingSettingsInput>> = z.object({
  salesTaxRateBp: readText<number>((text) => {
    const bp = percentToBp(text);
    if (bp === null) return { message: "Enter a percentage like 8.75 (two decimals at most)." };
    if (bp > 3000) return { message: "At most 30 %." };
    return { value: bp };
  }),
  invoicePrefix: z.string().trim().regex(/^[A-Z]{1,6}$/, "1 to 6 capital letters, e.g. HB."),
  creditHoldDays: readText<number>((text) => {
    const days = /^\d+$/.test(text.trim()) ? Number(text.trim()) : Number.NaN;
    if (!Number.isInteger(days) || days < 1) return { message: "At least 1 day." };
    if (days > 180) return { message: "At most 180 days." };
    return { value: days };
  }),
  paymentInstructions: z.string().trim().max(600, "At most 600 characters."),
});
