import { z } from "zod";
import { readText } from "../../forms/textSchemas";
import type { CreditNoteInput } from "../../api/invoices";
import { parseMoney, toDecimal } from "../../../shared/money";
import { taxCents } from "../../../shared/billing";

/** One line of the credit-note form, as typed; `key` keeps React rows apart while lines come and go. */
export interface CreditLineValues {
  key: number;
  description: string;
  quantity: string;
  unitPrice: string;
}

export type Settle = "auto" | "carry";

export interface CreditNoteValues {
  reason: string;
  lines: CreditLineValues[];
  settle: Settle;
}

/** The credit note's errors sit beside its reason, its list of lines, and each line's inputs. */
export const isCreditNoteField = (name: string) => name === "reason" || name === "lines" || name.startsWith("lines.");

const wholeQuantity = (text: string) => (/^\d+$/.test(text.trim()) ? Number(text.trim()) : Number.NaN);

/** The form's text values under the server's names, for `creditNoteSchema`. */
export function creditNoteInput(v: CreditNoteValues) {
  return {
    reason: v.reason,
    lines: v.lines.map((l) => ({ description: l.description, quantity: l.quantity, unitPriceCents: l.unitPrice })),
    ...(v.settle === "carry" ? { carry: true as const } : {}),
  };
}

/** The credit note checked before sending: a reason, at least one line, each with what, how many and a price. */
export function creditNoteSchema(currency: string): z.ZodType<CreditNoteInput, ReturnType<typeof creditNoteInput>> {
  const line = z.object({
    description: z.string().trim().min(1, "Say what is credited."),
    quantity: readText<number>((text) => {
      const q = wholeQuantity(text);
      return Number.isInteger(q) && q >= 1 ? { value: q } : { message: "At least 1." };
    }),
    unitPriceCents: readText<number>((text) => {
      const p = parseMoney(text, currency);
      return p !== null && p > 0 ? { value: p } : { message: `A price like ${toDecimal(450, currency)}.` };
    }),
  });
  return z.object({
    reason: z.string().trim().min(1, "Say why (short delivery, damaged, …)."),
    lines: z.array(line).min(1, "Add what is credited."),
    carry: z.literal(true).optional(),
  });
}

/** What the credit comes to with tax, from the lines as typed (unreadable lines count as 0). */
export function creditPreviewCents(lines: CreditLineValues[], currency: string, taxRateBp: number): number {
  const net = lines.reduce((s, l) => {
    const q = /^\d+$/.test(l.quantity.trim()) ? Number(l.quantity) : 0;
    return s + q * (parseMoney(l.unitPrice, currency) ?? 0);
  }, 0);
  return net + taxCents(net, taxRateBp);
}
