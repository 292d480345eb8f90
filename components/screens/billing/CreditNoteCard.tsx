import React, { useMemo, useRef, useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { FieldFrame } from "../../ui/Field";
import { FormActions } from "../../ui/FormActions";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useCreditNoteMutation, type InvoiceDetailDto } from "../../api/invoices";
import { useZodForm } from "../../forms/useZodForm";
import { toDecimal } from "../../../shared/money";
import { DISPOSITION_LABELS, billingStyles, money, percent } from "./parts";
import { creditNoteInput, creditNoteSchema, creditPreviewCents, isCreditNoteField, type CreditLineValues, type CreditNoteValues, type Settle } from "./creditNoteForm";
import { colors, layout, radii, space } from "../../theme";

const EMPTY: CreditNoteValues = { reason: "", lines: [], settle: "auto" };

/** A credit note for short or damaged goods: off what is owed, back to the card when paid by card, or carried forward. */
export function CreditNoteCard({ detail }: { detail: InvoiceDetailDto }) {
  const inv = detail.invoice;
  const mutation = useCreditNoteMutation(inv.id);
  const schema = useMemo(() => creditNoteSchema(inv.currency), [inv.currency]);
  const form = useZodForm({ schema, initial: EMPTY, toInput: creditNoteInput, fields: isCreditNoteField, manyMessage: null });
  const [open, setOpen] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const nextKey = useRef(1);
  const { values, errors } = form;
  const lines = values.lines;

  const add = (l: Omit<CreditLineValues, "key">) => form.setValue("lines", [...lines, { ...l, key: nextKey.current++ }]);
  const update = (key: number, patch: Partial<CreditLineValues>) => form.setValue("lines", lines.map((l) => (l.key === key ? { ...l, ...patch } : l)));
  const remove = (key: number) => form.setValue("lines", lines.filter((l) => l.key !== key));
  const start = () => {
    setDone(null);
    form.reset(EMPTY);
    setOpen(true);
  };

  const previewTotal = creditPreviewCents(lines, inv.currency, inv.taxRateBp);

  const submit = () =>
    void form.submit(async (input) => {
      const cn = await mutation.mutateAsync(input);
      setOpen(false);
      setDone(`Credit note ${cn.number} for ${money(cn.totalCents, inv.currency)}: ${DISPOSITION_LABELS[cn.disposition].toLowerCase()}.`);
    });

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
          <FormError message={form.formError} testID="credit-note-error" />
          <TextField label="Reason" placeholder="Short delivery, damaged in transit, …" {...form.text("reason")} testID="credit-reason" maxLength={300} />
          <FieldFrame label="What is credited" error={errors.lines} testID="credit-lines">
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
          </FieldFrame>
          {lines.map((l, i) => (
            <CreditLine key={l.key} line={l} index={i} currency={inv.currency} errors={errors} onChange={(patch) => update(l.key, patch)} onRemove={() => remove(l.key)} />
          ))}
          <Button label="Add a line" icon="plus" variant="ghost" small onPress={() => add({ description: "", quantity: "1", unitPrice: "" })} testID="credit-add-line" />
          <ChoiceGroup<Settle>
            label="Settle it"
            layout="list"
            value={values.settle}
            onChange={form.set("settle")}
            testID="credit-settle"
            choices={[
              { value: "auto", label: "The usual way", hint: "Off what is still owed; back to the card if it was paid by card." },
              { value: "carry", label: "Carry to the next invoice", hint: "Keep it as credit for the account's next invoice." },
            ]}
          />
          <AppText variant="bodyStrong" testID="credit-preview">
            {`Credit with tax: ${money(previewTotal, inv.currency)}${inv.taxRateBp ? ` (tax ${percent(inv.taxRateBp)})` : ""}`}
          </AppText>
          <FormActions submitLabel="Issue credit note" busy={form.submitting} onSubmit={submit} submitTestID="credit-submit" onCancel={() => setOpen(false)} cancelTestID="credit-cancel" />
        </View>
      )}
    </Card>
  );
}

interface CreditLineProps {
  line: CreditLineValues;
  index: number;
  currency: string;
  errors: Record<string, string>;
  onChange: (patch: Partial<CreditLineValues>) => void;
  onRemove: () => void;
}

/** One credited line: what, how many, at what price, and removing it. */
function CreditLine({ line: l, index: i, currency, errors, onChange, onRemove }: CreditLineProps) {
  return (
    <View style={styles.line} testID={`credit-line-${i}`}>
      <TextField label="Description" value={l.description} onChangeText={(t) => onChange({ description: t })} error={errors[`lines.${i}.description`]} testID={`credit-line-${i}-description`} maxLength={200} />
      <View style={styles.lineRow}>
        <View style={styles.lineQty}>
          <TextField label="Quantity" value={l.quantity} onChangeText={(t) => onChange({ quantity: t })} error={errors[`lines.${i}.quantity`]} testID={`credit-line-${i}-quantity`} inputMode="numeric" maxLength={5} />
        </View>
        <View style={styles.linePrice}>
          <TextField label={`Unit price (${currency})`} value={l.unitPrice} onChangeText={(t) => onChange({ unitPrice: t })} error={errors[`lines.${i}.unitPriceCents`]} testID={`credit-line-${i}-price`} inputMode="decimal" />
        </View>
        <Pressable accessibilityRole="button" accessibilityLabel={`Remove credit line ${i + 1}`} onPress={onRemove} testID={`credit-line-${i}-remove`} style={({ pressed }) => [styles.remove, pressed && styles.removePressed]}>
          <Feather name="trash-2" size={18} color={colors.dangerInk} />
        </Pressable>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  fromInvoice: { gap: space.xs },
  line: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.page, borderWidth: 1, borderColor: colors.border },
  lineRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", gap: space.sm },
  lineQty: { width: 110 },
  linePrice: { flexGrow: 1, flexBasis: 140 },
  remove: { width: layout.minTouch, height: layout.minTouch, borderRadius: radii.pill, alignItems: "center", justifyContent: "center", marginBottom: 2 },
  removePressed: { backgroundColor: colors.dangerSoft },
});
