import { z } from "zod";
import { readText } from "../../forms/textSchemas";
import { cleanDate } from "../../ordering/dates";
import { PAYMENT_METHODS, type ManualPaymentMethod, type PaymentInput } from "../../api/invoices";
import { parseMoney, toDecimal } from "../../../shared/money";
import { money } from "./parts";

/** The payment form's inputs, as typed. */
export interface PaymentValues {
  amount: string;
  method: ManualPaymentMethod | null;
  reference: string;
  receivedOn: string;
}

/** The names the server gives the payment's fields (errors go beside the inputs under these names). */
export const PAYMENT_FIELDS = ["amountCents", "method", "reference", "receivedOn"] as const;

/** The form's text values under the server's names, for `paymentSchema`. */
export function paymentInput(v: PaymentValues) {
  return { amountCents: v.amount, method: v.method, reference: v.reference, receivedOn: v.receivedOn };
}

/** The payment form checked before sending (the server checks the same again): at most what is still owed. */
export function paymentSchema(dueCents: number, currency: string): z.ZodType<PaymentInput, ReturnType<typeof paymentInput>> {
  return z.object({
    amountCents: readText<number>((text) => {
      const cents = parseMoney(text, currency);
      if (!text.trim()) return { message: "Enter the amount received." };
      if (cents === null) return { message: `Enter an amount like ${toDecimal(1250, currency)}.` };
      if (cents <= 0) return { message: "The amount must be more than 0." };
      if (cents > dueCents) return { message: `At most ${money(dueCents, currency)}, what is still owed.` };
      return { value: cents };
    }),
    method: z.enum(PAYMENT_METHODS, { error: "Choose how it was paid." }),
    reference: z.string().trim().min(1, "Enter the transfer reference or check number.").max(120, "At most 120 characters."),
    receivedOn: readText<string>((text) => (cleanDate(text) ? { value: text.trim() } : { message: "Write the date as YYYY-MM-DD." })),
  });
}
