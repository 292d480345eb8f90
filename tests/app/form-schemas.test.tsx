/**
 * The forms' own zod schemas over what people type (components/screens/…/*Form.ts), checked with the
 * forms' `validate`: the same messages the hand-written checks gave, and the parsed input the API takes.
 */
import { validate } from "../../components/forms/errors";
import { paymentInput, paymentSchema } from "../../components/screens/billing/paymentForm";
import { creditNoteInput, creditNoteSchema, creditPreviewCents, isCreditNoteField } from "../../components/screens/billing/creditNoteForm";
import { billingSettingsInput, billingSettingsSchema, billingSettingsValues, bpToPercentText, percentToBp } from "../../components/screens/billing/billingSettingsForm";
import { deliveryInput, deliverySchema } from "../../components/screens/accounts/deliveryForm";
import { priceListFormInput, priceListFormSchema, priceListValues } from "../../components/screens/pricing/priceListForm";
import { closureSchema, withClosure } from "../../components/screens/settings/closureForm";
import { PASSWORD_AGAIN, PASSWORD_MISMATCH, withConfirmation } from "../../components/screens/auth/newPassword";
import { passwordResetConfirmSchema } from "../../shared/schemas/auth";

describe("payment form", () => {
  const schema = paymentSchema(4500, "USD");
  it("names each missing or wrong input", () => {
    expect(validate(schema, paymentInput({ amount: "", method: null, reference: " ", receivedOn: "3/12" }))).toEqual({
      ok: false,
      fields: { amountCents: "Enter the amount received.", method: "Choose how it was paid.", reference: "Enter the transfer reference or check number.", receivedOn: "Write the date as YYYY-MM-DD." },
    });
    const over = validate(schema, paymentInput({ amount: "45.01", method: "cash", reference: "x", receivedOn: "2025-12-02" }));
    expect(over.ok ? null : over.fields.amountCents).toBe("At most $45.00, what is still owed.");
    const zero = validate(schema, paymentInput({ amount: "0", method: "cash", reference: "x", receivedOn: "2025-12-02" }));
    expect(zero.ok ? null : zero.fields.amountCents).toBe("The amount must be more than 0.");
    const odd = validate(schema, paymentInput({ amount: "12,5x", method: "cash", reference: "x", receivedOn: "2025-12-02" }));
    expect(odd.ok ? null : odd.fields.amountCents).toBe("Enter an amount like 12.50.");
  });
  it("parses what the API takes", () => {
    expect(validate(schema, paymentInput({ amount: "45", method: "cheque", reference: " 1042 ", receivedOn: " 2025-12-02 " }))).toEqual({
      ok: true,
      data: { amountCents: 4500, method: "cheque", reference: "1042", receivedOn: "2025-12-02" },
    });
  });
});

describe("credit-note form", () => {
  const schema = creditNoteSchema("USD");
  it("needs a reason and a line, and checks each line's inputs", () => {
    expect(validate(schema, creditNoteInput({ reason: "", lines: [], settle: "auto" }))).toEqual({ ok: false, fields: { reason: "Say why (short delivery, damaged, …).", lines: "Add what is credited." } });
    const bad = validate(schema, creditNoteInput({ reason: "Short", lines: [{ key: 1, description: " ", quantity: "0", unitPrice: "free" }], settle: "auto" }));
    expect(bad).toEqual({ ok: false, fields: { "lines.0.description": "Say what is credited.", "lines.0.quantity": "At least 1.", "lines.0.unitPriceCents": "A price like 4.50." } });
    expect(["reason", "lines", "lines.3.quantity"].every(isCreditNoteField)).toBe(true);
    expect(isCreditNoteField("invoiceId")).toBe(false);
  });
  it("parses the lines, and carries only when asked", () => {
    const lines = [{ key: 1, description: " Rolls ", quantity: "2", unitPrice: "4.50" }];
    expect(validate(schema, creditNoteInput({ reason: " Short ", lines, settle: "carry" }))).toEqual({ ok: true, data: { reason: "Short", lines: [{ description: "Rolls", quantity: 2, unitPriceCents: 450 }], carry: true } });
    const usual = validate(schema, creditNoteInput({ reason: "Short", lines, settle: "auto" }));
    expect(usual.ok && "carry" in usual.data ? usual.data.carry : undefined).toBeUndefined();
    // 2 × 4.50 = 9.00, tax 8.75 % = 0.7875 → 0.79 (half up).
    expect(creditPreviewCents([...lines, { key: 2, description: "?", quantity: "x", unitPrice: "1" }], "USD", 875)).toBe(979);
  });
});

describe("billing settings form", () => {
  it("reads percent text as basis points and back", () => {
    expect(percentToBp("8.75")).toBe(875);
    expect(percentToBp("8.75 %")).toBe(875);
    expect(percentToBp("8.755")).toBeNull();
    expect(bpToPercentText(875)).toBe("8.75");
    expect(bpToPercentText(800)).toBe("8");
  });
  it("gives the same messages, and parses the settings", () => {
    const bad = validate(billingSettingsSchema, billingSettingsInput({ taxPercent: "31", invoicePrefix: "hb", creditHoldDays: "0", paymentInstructions: "x".repeat(601) }));
    expect(bad).toEqual({ ok: false, fields: { salesTaxRateBp: "At most 30 %.", invoicePrefix: "1 to 6 capital letters, e.g. HB.", creditHoldDays: "At least 1 day.", paymentInstructions: "At most 600 characters." } });
    const values = billingSettingsValues({ salesTaxRateBp: 825, invoicePrefix: "HB", creditHoldDays: 30, paymentInstructions: "Bank: 123 ", remindersOn: false });
    expect(validate(billingSettingsSchema, billingSettingsInput(values))).toEqual({ ok: true, data: { salesTaxRateBp: 825, invoicePrefix: "HB", creditHoldDays: 30, paymentInstructions: "Bank: 123" } });
    const days = validate(billingSettingsSchema, billingSettingsInput({ ...values, creditHoldDays: "181" }));
    expect(days.ok ? null : days.fields.creditHoldDays).toBe("At most 180 days.");
  });
});

describe("delivery terms form", () => {
  it("reads the minimum in dollars (empty is none), then needs a day when only some are chosen", () => {
    expect(validate(deliverySchema, deliveryInput({ everyDay: false, days: [], minimum: "abc", priceListId: "none" }))).toEqual({
      ok: false,
      fields: { minimumOrderCents: "Write it in dollars and cents, like 50.00 (empty for no minimum)." },
    });
    expect(validate(deliverySchema, deliveryInput({ everyDay: false, days: [], minimum: "", priceListId: "none" }))).toEqual({ ok: false, fields: { routeWeekdays: "Choose at least one day, or deliver on every delivery day." } });
    expect(validate(deliverySchema, deliveryInput({ everyDay: true, days: [2], minimum: "50", priceListId: "4" }))).toEqual({ ok: true, data: { routeWeekdays: null, minimumOrderCents: 5000, priceListId: 4 } });
  });
});

describe("price list form", () => {
  const fixed = { ...priceListValues(undefined), name: "Hotel", kind: "fixed" as const };
  it("puts an unreadable own price beside its product, and asks for one price on a fixed list", () => {
    expect(validate(priceListFormSchema, priceListFormInput({ ...fixed, prices: { 102: "twelve" } }, [101, 102]))).toEqual({ ok: false, fields: { "price.102": "Write it in dollars and cents, like 16.50." } });
    expect(validate(priceListFormSchema, priceListFormInput({ ...fixed, name: "" }, [101, 102]))).toEqual({ ok: false, fields: { name: "Name the price list.", items: "Set a price for at least one product." } });
  });
  it("sends own prices of the shown products in their order, none for a percentage", () => {
    expect(validate(priceListFormSchema, priceListFormInput({ ...fixed, prices: { 102: "14.25", 101: "9", 7: "1" } }, [102, 101]))).toEqual({
      ok: true,
      data: { name: "Hotel", kind: "fixed", percentOff: 0, items: [{ productId: 102, priceCents: 1425 }, { productId: 101, priceCents: 900 }] },
    });
    expect(validate(priceListFormSchema, priceListFormInput({ ...fixed, kind: "percent", percent: "12.5", prices: { 102: "1" } }, [102]))).toEqual({ ok: true, data: { name: "Hotel", kind: "percent", percentOff: 12.5, items: [] } });
  });
});

describe("closed dates", () => {
  it("takes a date once, with its note trimmed, and keeps the list in date order", () => {
    const list = [{ date: "2025-12-25", note: "Christmas" }];
    expect(validate(closureSchema(list), { date: "25/12", note: "" })).toEqual({ ok: false, fields: { date: "Write the date as YYYY-MM-DD (year, month, day)." } });
    expect(validate(closureSchema(list), { date: " 2025-12-25", note: "" })).toEqual({ ok: false, fields: { date: "That date is already on the list." } });
    expect(validate(closureSchema(list), { date: "2025-12-24", note: " Eve " })).toEqual({ ok: true, data: { date: "2025-12-24", note: "Eve" } });
    expect(withClosure(list, { date: "2025-12-24", note: "" }).map((c) => c.date)).toEqual(["2025-12-24", "2025-12-25"]);
  });
});

describe("new password with its confirmation", () => {
  const schema = withConfirmation(passwordResetConfirmSchema);
  const good = "correct horse battery staple";
  it("the shared schema's messages first, then the confirmation's", () => {
    const short = validate(schema, { token: "t".repeat(43), password: "short", confirm: "" });
    expect(short.ok ? null : short.fields.confirm).toBe(PASSWORD_AGAIN);
    expect(short.ok ? null : short.fields.password).toBeTruthy();
    expect(validate(schema, { token: "t".repeat(43), password: good, confirm: "" })).toEqual({ ok: false, fields: { confirm: PASSWORD_MISMATCH } });
    expect(validate(schema, { token: "t".repeat(43), password: good, confirm: `${good}!` })).toEqual({ ok: false, fields: { confirm: PASSWORD_MISMATCH } });
  });
  it("sends what the shared schema parses, never the confirmation", () => {
    const ok = validate(schema, { token: "t".repeat(43), password: good, confirm: good });
    expect(ok.ok ? ok.data : null).toEqual(validate(passwordResetConfirmSchema, { token: "t".repeat(43), password: good }).ok ? { token: "t".repeat(43), password: good } : null);
  });
});
