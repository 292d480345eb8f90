import React, { useEffect, useMemo, useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { DateField } from "../../ui/DateField";
import { TextLink } from "../../ui/TextLink";
import { Stepper } from "../../ui/Stepper";
import { AppText } from "../../ui/Text";
import { FormError, Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery, useBakeryTimeZone } from "../../api/bakery";
import { useProductsQuery } from "../../api/products";
import { ApiError, messageOf } from "../../api/client";
import { ordersApi, useOrderChanged, useOrdersQuery } from "../../api/orders";
import { addDays, cleanDate, formatCutoff, formatDay } from "../../ordering/dates";
import { money } from "../billing/parts";
import { combinedQuery } from "../ordering/combinedQuery";
import { listTotalCents, phoneLines, quantitiesOf, type Quantities } from "./phoneOrder";
import type { AccountDto } from "../../../shared/schemas/accounts";
import type { ProductDto } from "../../../shared/schemas/catalog";
import type { OrderDto } from "../../../shared/schemas/orders";
import { colors, radii, space } from "../../theme";

/** The office takes an order by phone for an account: the same rules as the buyer's screen, and the owner may set the cut-off aside. */
export function PhoneOrderScreen({ accountId, date: askedDate }: { accountId: number; date?: string }) {
  const account = useAccountQuery(accountId);
  const products = useProductsQuery();
  const bakery = useBakeryQuery();
  const loaded = combinedQuery([account, products, bakery], account.data && products.data && bakery.data ? { account: account.data, products: products.data.filter((p) => p.active), today: bakery.data.today } : undefined);
  return (
    <Screen testID="phone-order-screen">
      <TextLink href={`/office/accounts/${accountId}`} label="‹ Back to the account" testID="phone-order-back" />
      <QueryStates query={loaded} loadingLabel="Loading the account and the products…" errorTitle="The order form didn't load">
        {(d) => <PhoneOrderForm account={d.account} products={d.products} today={d.today} initialDate={(askedDate && cleanDate(askedDate)) || addDays(d.today, 1)} />}
      </QueryStates>
    </Screen>
  );
}

type Pending = { kind: "save" } | { kind: "cancel" };

function PhoneOrderForm({ account, products, today, initialDate }: { account: AccountDto; products: ProductDto[]; today: string; initialDate: string }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const timeZone = useBakeryTimeZone();
  const changed = useOrderChanged();
  const [date, setDate] = useState(initialDate);
  const [typedDate, setTypedDate] = useState(initialDate);
  const orders = useOrdersQuery({ accountId: account.id, from: date, to: date });
  const existing: OrderDto | null = orders.data?.find((o) => o.status !== "cancelled") ?? null;
  const [quantities, setQuantities] = useState<Quantities>({});
  const [poNumber, setPoNumber] = useState("");
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  // A write the server refused for the cut-off: the owner may confirm it again with a reason.
  const [late, setLate] = useState<{ pending: Pending; message: string } | null>(null);
  const [reason, setReason] = useState("");

  // A new date (or its order arriving) starts the form from that date's order.
  const existingKey = existing ? `${existing.id}-${existing.updatedAt}` : "none";
  useEffect(() => {
    setQuantities(quantitiesOf(existing));
    setPoNumber(existing?.poNumber ?? "");
    setNote(existing?.note ?? "");
    setLate(null);
    setError(null);
    setFields({});
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [date, existingKey]);

  const { lines, bad } = useMemo(() => phoneLines(products, quantities), [products, quantities]);
  const estimate = listTotalCents(products, lines);

  const run = async (pending: Pending, overrideReason?: string) => {
    setBusy(true);
    setError(null);
    setFields({});
    setDone(null);
    const cutoffOverride = overrideReason ? { confirm: true as const, reason: overrideReason } : undefined;
    try {
      let saved: OrderDto;
      if (pending.kind === "cancel" && existing) saved = await ordersApi.cancel(existing.id, overrideReason);
      else if (existing) saved = await ordersApi.update(existing.id, { lines, poNumber, note, cutoffOverride });
      else saved = await ordersApi.create({ accountId: account.id, deliveryDate: date, lines, poNumber, note, cutoffOverride }, `phone-${account.id}-${date}-${Date.now()}`);
      changed(saved);
      void orders.refetch();
      setLate(null);
      setReason("");
      const past = saved.cutoffOverride ? ` Taken past the cut-off: ${saved.cutoffOverride.reason}.` : "";
      setDone(
        saved.status === "cancelled"
          ? `The order for ${formatDay(date)} is canceled.${past}`
          : `Order ${existing ? "saved" : "placed"} for ${account.businessName} on ${formatDay(date)}: ${money(saved.totalCents)}.${past}`,
      );
    } catch (err) {
      if (err instanceof ApiError && err.code === "cutoff_passed") {
        // The office's own words (the server's sentence is written for the buyer: "call the bakery").
        const at = typeof err.details.cutoffAt === "string" ? formatCutoff(err.details.cutoffAt, timeZone) : null;
        setLate({ pending, message: `Orders for ${formatDay(date)} closed at the cut-off${at ? `, ${at}` : ""}.` });
      }
      else {
        setError(messageOf(err));
        if (err instanceof ApiError && err.fields) setFields(err.fields);
      }
    } finally {
      setBusy(false);
    }
  };

  const goTo = (text: string) => {
    setTypedDate(text);
    const d = cleanDate(text);
    if (d) {
      setDate(d);
      setDone(null);
    }
  };

  return (
    <>
      <PageHeader overline="Order by phone" title={account.businessName} subtitle={`${account.contactName || "Contact not given"}${account.contactPhone ? ` · ${account.contactPhone}` : ""}`} testID="phone-order-title" />
      <Card title="Delivery date" testID="phone-order-date-card">
        <DateField label="Delivery date" value={typedDate} onChangeText={goTo} min={today} testID="phone-order-date" />
        <AppText color="muted" testID="phone-order-existing">
          {orders.isPending
            ? "Looking for an order on this date…"
            : existing
              ? `${account.businessName} already has an order for ${formatDay(date)} (${money(existing.totalCents)}): change it below.`
              : `No order for ${formatDay(date)} yet.`}
        </AppText>
      </Card>
      <Card title="What they want" testID="phone-order-lines">
        <AppText variant="small" color="muted">
          List prices are shown; the account's own prices are applied when the order is saved.
        </AppText>
        {products.map((p) => (
          <View key={p.id} style={styles.line}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{p.name}</AppText>
              <AppText variant="small" color="muted">{`${p.saleUnit} · ${money(p.listPriceCents)}`}</AppText>
            </View>
            <Stepper label={p.name} value={quantities[p.id] ?? ""} onChange={(t) => setQuantities({ ...quantities, [p.id]: t })} min={p.minQuantity} max={p.maxQuantity} disabled={busy} testID={`phone-qty-${p.id}`} />
          </View>
        ))}
        {bad.length ? <FormError message={`Write whole numbers for ${bad.join(", ")}.`} testID="phone-order-bad" /> : null}
        <AppText variant="bodyStrong" testID="phone-order-estimate">{`About ${money(estimate)} at list prices`}</AppText>
      </Card>
      <Card title="Details">
        <TextField label="PO number" optional value={poNumber} onChangeText={setPoNumber} maxLength={40} error={fields.poNumber} testID="phone-order-po" />
        <TextField label="Note for the bakery" optional value={note} onChangeText={setNote} maxLength={500} multiline error={fields.note} testID="phone-order-note" />
      </Card>
      {late ? (
        <View style={styles.late} testID="phone-order-late">
          <AppText variant="bodyStrong" color="dangerInk">
            {late.message}
          </AppText>
          {isOwner ? (
            <>
              <AppText>The cut-off protects the bake: take this only if the bakery can still make it. The reason is kept on the order.</AppText>
              <TextField label="Why the cut-off is set aside" value={reason} onChangeText={setReason} maxLength={200} placeholder="e.g. Phoned at 3 pm; the oven has room" error={fields["cutoffOverride.reason"]} testID="phone-order-reason" />
              <View style={styles.buttons}>
                <Button
                  label={late.pending.kind === "cancel" ? "Yes, cancel past the cut-off" : "Yes, take it past the cut-off"}
                  variant="danger"
                  busy={busy}
                  disabled={reason.trim().length < 3}
                  onPress={() => void run(late.pending, reason.trim())}
                  testID="phone-order-override"
                />
                <Button label="Don't" variant="secondary" onPress={() => setLate(null)} testID="phone-order-override-no" />
              </View>
            </>
          ) : (
            <AppText testID="phone-order-owner-only">Only the owner can take or change an order past its cut-off.</AppText>
          )}
        </View>
      ) : null}
      <FormError message={error} testID="phone-order-error" />
      {done ? <Notice message={done} testID="phone-order-done" /> : null}
      <View style={styles.buttons}>
        <Button label={existing ? "Save changes" : "Place order"} icon="check" busy={busy && late === null} disabled={busy || bad.length > 0 || lines.length === 0 || !!late} onPress={() => void run({ kind: "save" })} testID="phone-order-submit" />
        {existing ? <Button label="Cancel this order" icon="x" variant="ghost" disabled={busy || !!late} onPress={() => void run({ kind: "cancel" })} testID="phone-order-cancel" /> : null}
      </View>
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  line: { flexDirection: "row", alignItems: "center", gap: space.md, flexWrap: "wrap", paddingVertical: space.xs },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  late: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
});
