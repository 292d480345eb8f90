import React, { useEffect, useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { ApiError, messageOf } from "../../api/client";
import { PAYMENT_METHODS, useCreditNoteMutation, useRecordPaymentMutation, type CreditNoteInput, type InvoiceDetailDto, type ManualPaymentMethod, type PaymentInput } from "../../api/invoices";
import { useBakeryQuery } from "../../api/bakery";
import { cleanDate } from "../../ordering/dates";
import { parseMoney, toDecimal } from "../../../shared/money";
import { taxCents } from "../../../shared/billing";
import type { FieldErrors } from "../../../shared/errors";
import { DISPOSITION_LABELS, METHOD_LABELS, billingStyles, money, percent } from "./parts";
import { colors, layout, radii, space } from "../../theme";

// ---- record a payment -------------------------------------------------------------------------

export interface PaymentValues {
  amount: string;
  method: ManualPaymentMethod | null;
  reference: string;
  receivedOn: string;
}

/** Check the payment form before sending it; the server checks the same again. */
export function checkPayment(values: PaymentValues, dueCents: number, currency: string): { ok: true; input: PaymentInput } | { ok: false; fields: FieldErrors } {
  const fields: FieldErrors = {};
  const cents = parseMoney(values.amount, currency);
  if (!values.amount.trim()) fields.amountCents = "Enter the amount received.";
  else if (cents === null) fields.amountCents = `Enter an amount like ${toDecimal(1250, currency)}.`;
  else if (cents <= 0) fields.amountCents = "The amount must be more than 0.";
  else if (cents > dueCents) fields.amountCents = `At most ${money(dueCents, currency)}, what is still owed.`;
  if (!values.method) fields.method = "Choose how it was paid.";
  if (!values.reference.trim()) fields.reference = "Enter the transfer reference or check number.";
  else if (values.reference.trim().length > 120) fields.reference = "At most 120 characters.";
  if (!cleanDate(values.receivedOn)) fields.receivedOn = "Write the date as YYYY-MM-DD.";
  if (Object.keys(fields).length || cents === null || !values.method) return { ok: false, fields };
  return { ok: true, input: { amountCents: cents, method: values.method, reference: values.reference.trim(), receivedOn: values.receivedOn.trim() } };
}

const PAYMENT_FIELDS = ["amountCents", "method", "reference", "receivedOn"] as const;

/** The office records money that came in another way than by card: a transfer, a check, cash. */
export function RecordPaymentCard({ detail }: { detail: InvoiceDetailDto }) {
  const inv = detail.invoice;
  const today = useBakeryQuery().data?.today ?? "";
  const mutation = useRecordPaymentMutation(inv.id);
  const [open, setOpen] = useState(false);
  const [values, setValues] = useState<PaymentValues>({ amount: "", method: null, reference: "", receivedOn: "" });
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const set = (patch: Partial<PaymentValues>) => setValues((v) => ({ ...v, ...patch }));
  // The bakery's today may arrive after the form opened: fill it in once.
  useEffect(() => {
    if (today) setValues((v) => (v.receivedOn ? v : { ...v, receivedOn: today }));
  }, [today]);

  const start = () => {
    setSaved(null);
    setFields({});
    setFormError(null);
    setValues({ amount: toDecimal(inv.amountDueCents, inv.currency), method: null, reference: "", receivedOn: today });
    setOpen(true);
  };

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = checkPayment(values, inv.amountDueCents, inv.currency);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    mutation.mutate(checked.input, {
      onSuccess: (p) => {
        setOpen(false);
        setSaved(`${METHOD_LABELS[p.method]} of ${money(p.amountCents, inv.currency)} recorded.`);
      },
      onError: (err) => {
        if (err instanceof ApiError && err.fields) {
          const mine: FieldErrors = {};
          const others: string[] = [];
          for (const [k, m] of Object.entries(err.fields)) (PAYMENT_FIELDS as readonly string[]).includes(k) ? (mine[k] = m) : others.push(m);
          setFields(mine);
          setFormError(Object.keys(mine).length ? (others.length ? err.message : null) : err.message);
        } else setFormError(messageOf(err));
      },
    });
  };

  return (
    <Card title="Record a payment" testID="record-payment-card">
      {saved ? <Notice message={saved} testID="payment-saved" /> : null}
      {!open ? (
        <>
          <AppText color="muted">A bank transfer, check or cash that reached the bakery. Card payments are recorded on their own.</AppText>
          <Button label="Record a payment" icon="plus" variant="secondary" onPress={start} testID="record-payment-open" />
        </>
      ) : (
        <View style={styles.form}>
          <FormError message={formError} testID="payment-error" />
          <TextField
            label={`Amount (${inv.currency})`}
            hint={`Still owed: ${money(inv.amountDueCents, inv.currency)}`}
            value={values.amount}
            onChangeText={(t) => set({ amount: t })}
            error={fields.amountCents}
            testID="payment-amount"
            inputMode="decimal"
            keyboardType="decimal-pad"
          />
          <ChoiceGroup<ManualPaymentMethod>
            label="Paid by"
            value={values.method}
            onChange={(m) => set({ method: m })}
            error={fields.method}
            testID="payment-method"
            choices={PAYMENT_METHODS.map((m) => ({ value: m, label: METHOD_LABELS[m] }))}
          />
          <TextField label="Reference" hint="The transfer reference or check number." value={values.reference} onChangeText={(t) => set({ reference: t })} error={fields.reference} testID="payment-reference" maxLength={120} autoCorrect={false} />
          <TextField label="Received on" placeholder="YYYY-MM-DD" value={values.receivedOn} onChangeText={(t) => set({ receivedOn: t })} error={fields.receivedOn} testID="payment-received-on" inputMode="numeric" maxLength={10} />
          <View style={billingStyles.buttons}>
            <Button label="Save payment" icon="check" busy={mutation.isPending} onPress={submit} testID="payment-submit" />
            <Button label="Cancel" variant="ghost" onPress={() => setOpen(false)} testID="payment-cancel" />
          </View>
        </View>
      )}
    </Card>
  );
}

// ---- credit notes -----------------------------------------------------------------------------

export interface CreditLineValues {
  key: number;
  description: string;
  quantity: string;
  unitPrice: string;
}

export function checkCreditNote(reason: string, lines: CreditLineValues[], currency: string): { ok: true; input: Omit<CreditNoteInput, "carry"> } | { ok: false; fields: FieldErrors } {
  const fields: FieldErrors = {};
  if (!reason.trim()) fields.reason = "Say why (short delivery, damaged, …).";
  if (lines.length === 0) fields.lines = "Add what is credited.";
  const out: CreditNoteInput["lines"] = [];
  lines.forEach((l, i) => {
    const q = /^\d+$/.test(l.quantity.trim()) ? Number(l.quantity.trim()) : Number.NaN;
    const p = parseMoney(l.unitPrice, currency);
    if (!l.description.trim()) fields[`lines.${i}.description`] = "Say what is credited.";
    if (!Number.isInteger(q) || q < 1) fields[`lines.${i}.quantity`] = "At least 1.";
    if (p === null || p <= 0) fields[`lines.${i}.unitPriceCents`] = `A price like ${toDecimal(450, currency)}.`;
    out.push({ description: l.description.trim(), quantity: q, unitPriceCents: p ?? 0 });
  });
  if (Object.keys(fields).length) return { ok: false, fields };
  return { ok: true, input: { reason: reason.trim(), lines: out } };
}

type Settle = "auto" | "carry";

/** A credit note for short or damaged goods: off what is owed, back to the card when paid by card, or carried forward. */
export function CreditNoteCard({ detail }: { detail: InvoiceDetailDto }) {
  const inv = detail.invoice;
  const mutation = useCreditNoteMutation(inv.id);
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState("");
  const [lines, setLines] = useState<CreditLineValues[]>([]);
  const [settle, setSettle] = useState<Settle>("auto");
  const [nextKey, setNextKey] = useState(1);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const add = (l: Omit<CreditLineValues, "key">) => {
    setLines((ls) => [...ls, { ...l, key: nextKey }]);
    setNextKey((k) => k + 1);
  };
  const update = (key: number, patch: Partial<CreditLineValues>) => setLines((ls) => ls.map((l) => (l.key === key ? { ...l, ...patch } : l)));
  const remove = (key: number) => setLines((ls) => ls.filter((l) => l.key !== key));
  const start = () => {
    setDone(null);
    setFields({});
    setFormError(null);
    setReason("");
    setLines([]);
    setSettle("auto");
    setOpen(true);
  };

  const preview = lines.reduce((s, l) => {
    const q = /^\d+$/.test(l.quantity.trim()) ? Number(l.quantity) : 0;
    const p = parseMoney(l.unitPrice, inv.currency) ?? 0;
    return s + q * p;
  }, 0);
  const previewTotal = preview + taxCents(preview, inv.taxRateBp);

  const submit = () => {
    if (mutation.isPending) return;
    setFormError(null);
    const checked = checkCreditNote(reason, lines, inv.currency);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    mutation.mutate(
      { ...checked.input, ...(settle === "carry" ? { carry: true } : {}) },
      {
        onSuccess: (cn) => {
          setOpen(false);
          setDone(`Credit note ${cn.number} for ${money(cn.totalCents, inv.currency)}: ${DISPOSITION_LABELS[cn.disposition].toLowerCase()}.`);
        },
        onError: (err) => {
          if (err instanceof ApiError && err.fields) {
            setFields(err.fields);
            const known = Object.keys(err.fields).every((k) => k === "reason" || k === "lines" || k.startsWith("lines."));
            setFormError(known ? null : err.message);
          } else setFormError(messageOf(err));
        },
      },
    );
  };

  return (
    <Card title="Credit note" testID="credit-note-card">
      {done ? <Notice message={done} testID="credit-note-done" /> : null}
      {!open ? (
        <>
          <AppText color="muted">For goods that were short, damaged or returned. It comes off what is owed; on an invoice paid by card it goes back to the card; otherwise it is carried to the account&apos;s next invoice.</AppText>
          <Button label="Issue a credit note" icon="corner-up-left" variant="secondary" onPress={start} testID="credit-note-open" />
        </>
      ) : (
        <View style={styles.form}>
          <FormError message={formError} testID="credit-note-error" />
          <TextField label="Reason" placeholder="Short delivery, damaged in transit, …" value={reason} onChangeText={setReason} error={fields.reason} testID="credit-reason" maxLength={300} />
          <View style={styles.lineHead}>
            <AppText variant="label">What is credited</AppText>
            {fields.lines ? (
              <AppText variant="small" color="dangerInk" testID="credit-lines-error">
                {fields.lines}
              </AppText>
            ) : null}
          </View>
          {detail.lines.length ? (
            <View style={styles.fromInvoice}>
              <AppText variant="small" color="muted">
                Start from a line of the invoice:
              </AppText>
              <View style={billingStyles.buttons}>
                {detail.lines.map((l) => (
                  <Button
                    key={l.id}
                    small
                    variant="secondary"
                    icon="plus"
                    label={l.description}
                    onPress={() => add({ description: l.description, quantity: "1", unitPrice: toDecimal(l.unitPriceCents, inv.currency) })}
                    testID={`credit-from-line-${l.id}`}
                  />
                ))}
              </View>
            </View>
          ) : null}
          {lines.map((l, i) => (
            <View key={l.key} style={styles.line} testID={`credit-line-${i}`}>
              <TextField label="Description" value={l.description} onChangeText={(t) => update(l.key, { description: t })} error={fields[`lines.${i}.description`]} testID={`credit-line-${i}-description`} maxLength={200} />
              <View style={styles.lineRow}>
                <View style={styles.lineQty}>
                  <TextField label="Quantity" value={l.quantity} onChangeText={(t) => update(l.key, { quantity: t })} error={fields[`lines.${i}.quantity`]} testID={`credit-line-${i}-quantity`} inputMode="numeric" maxLength={5} />
                </View>
                <View style={styles.linePrice}>
                  <TextField label={`Unit price (${inv.currency})`} value={l.unitPrice} onChangeText={(t) => update(l.key, { unitPrice: t })} error={fields[`lines.${i}.unitPriceCents`]} testID={`credit-line-${i}-price`} inputMode="decimal" />
                </View>
                <Pressable accessibilityRole="button" accessibilityLabel={`Remove credit line ${i + 1}`} onPress={() => remove(l.key)} testID={`credit-line-${i}-remove`} style={({ pressed }) => [styles.remove, pressed && styles.removePressed]}>
                  <Feather name="trash-2" size={18} color={colors.dangerInk} />
                </Pressable>
              </View>
            </View>
          ))}
          <Button label="Add a line" icon="plus" variant="ghost" small onPress={() => add({ description: "", quantity: "1", unitPrice: "" })} testID="credit-add-line" />
          <ChoiceGroup<Settle>
            label="Settle it"
            layout="list"
            value={settle}
            onChange={setSettle}
            testID="credit-settle"
            choices={[
              { value: "auto", label: "The usual way", hint: "Off what is still owed; back to the card if it was paid by card." },
              { value: "carry", label: "Carry to the next invoice", hint: "Keep it as credit for the account's next invoice." },
            ]}
          />
          <AppText variant="bodyStrong" testID="credit-preview">
            {`Credit with tax: ${money(previewTotal, inv.currency)}${inv.taxRateBp ? ` (tax ${percent(inv.taxRateBp)})` : ""}`}
          </AppText>
          <View style={billingStyles.buttons}>
            <Button label="Issue credit note" icon="check" busy={mutation.isPending} onPress={submit} testID="credit-submit" />
            <Button label="Cancel" variant="ghost" onPress={() => setOpen(false)} testID="credit-cancel" />
          </View>
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  lineHead: { gap: space.xxs },
  fromInvoice: { gap: space.xs },
  line: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.page, borderWidth: 1, borderColor: colors.border },
  lineRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", gap: space.sm },
  lineQty: { width: 110 },
  linePrice: { flexGrow: 1, flexBasis: 140 },
  remove: { width: layout.minTouch, height: layout.minTouch, borderRadius: radii.pill, alignItems: "center", justifyContent: "center", marginBottom: 2 },
  removePressed: { backgroundColor: colors.dangerSoft },
});
