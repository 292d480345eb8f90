import React, { useMemo } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../../ui/Screen";
import { useZodForm } from "../../../forms/useZodForm";
import { useIsWide } from "../../../shell/useIsWide";
import { useMoney } from "../../../ordering/useMoney";
import { msUntil } from "../../../ordering/countdown";
import type { DraftOwner } from "../../../ordering/deviceDraft";
import { blockedReason, canSend, draftLines, goneLines, isDirty, orderValues, sentLines, summarizeDraft, type OrderValues } from "../../../ordering/draft";
import { useDeviceDraft } from "../../../ordering/useDeviceDraft";
import { useOrderSubmit, type OrderNotice } from "../../../ordering/useOrderSubmit";
import { useLeaveWarning } from "../../../ordering/useLeaveWarning";
import { orderCreateSchema, type OrderDto } from "../../../../shared/schemas/orders";
import type { CalendarDayDto, CalendarSettingsDto } from "../../../../shared/schemas/calendar";
import type { ProductDto } from "../../../../shared/schemas/catalog";
import { space } from "../../../theme";
import { OrderBanners } from "./OrderBanners";
import { OrderDetailsCard } from "./OrderDetailsCard";
import { OrderSummary } from "./OrderSummary";
import { ProductList } from "./ProductList";

export interface OrderFormProps {
  date: string;
  day: CalendarDayDto;
  products: ProductDto[];
  existing: OrderDto | null;
  minimumCents: number;
  settings?: CalendarSettingsDto;
  timeZone?: string;
  now: number;
  header: React.ReactNode;
  /** Whose device-kept draft this date may have (buyers only). */
  draftOwner: DraftOwner | null;
  /** The page's notice (shown at its top); a save's confirmation is also shown by the button pressed. */
  notice: OrderNotice | null;
  onNotice: (n: OrderNotice | null) => void;
  onExists: () => void;
  /** Why the account cannot order now (credit hold, paused by the bakery): the form is shown but its controls are off. */
  hold?: string | null;
}

/** What the form checks itself: the PO number and the note (the lines are checked by the draft, line by line). */
const detailsSchema = orderCreateSchema.pick({ poNumber: true, note: true });
const DETAIL_FIELDS = ["poNumber", "note"] as const;

/** Placing or changing one date's order: the products with their steppers, the details, the total and the button. */
export function OrderForm({ date, day, products, existing, minimumCents, settings, timeZone, now, header, draftOwner, notice, onNotice, onExists, hold = null }: OrderFormProps) {
  const wide = useIsWide();
  const money = useMoney();
  const baseDeadline = existing ? existing.cutoffAt : day.cutoffAt;
  const closedByClock = msUntil(baseDeadline, now) <= 0;
  // What "changed" is measured against: the order as last saved (the server's answer to a save replaces
  // `existing`), so after "Save changes" the button rests, and stepping back to the earlier quantities is a change.
  const saved = useMemo(() => orderValues(existing), [existing]);
  // The save's confirmation is shown by the button that was pressed, too (the page's notice may be out of view).
  const confirmation = notice?.tone === "success" ? notice.text : null;
  // An order that could not be saved earlier on this device comes back as it was typed.
  const deviceDraft = useDeviceDraft(draftOwner, date, existing, closedByClock);
  const form = useZodForm<OrderValues, typeof detailsSchema>({
    schema: detailsSchema,
    initial: () => {
      const r = deviceDraft.restored;
      return r ? { quantities: r.quantities, poNumber: r.poNumber, note: r.note } : saved;
    },
    fields: DETAIL_FIELDS,
  });
  const { quantities } = form.values;

  const lines = useMemo(() => draftLines(products, quantities, { date, day, settings, existing, now }), [products, quantities, date, day, settings, existing, now]);
  const summary = summarizeDraft(lines, minimumCents, baseDeadline, now);
  const gone = goneLines(existing, products);
  const sent = sentLines(summary.chosen);
  const dirty = isDirty({ lines: sent, poNumber: form.values.poNumber, note: form.values.note }, saved, gone.length);
  const order = useOrderSubmit({ form, date, day, products, existing, deviceDraft, money, now, onNotice, onExists });
  useLeaveWarning(dirty && !order.placed);

  const locked = closedByClock || !!order.serverClosed;
  // On hold the steppers, details and buttons are off as if the date were closed (the server would refuse them).
  const frozen = locked || !!hold;
  const busy = order.saving || order.cancelling;
  const blocked = hold ?? blockedReason({ locked, chosen: summary.chosen.length, problems: summary.problems, existing: !!existing });
  const canSubmit = !order.placed && !busy && canSend(summary, { locked: frozen, existing: !!existing, dirty });
  const submit = () => {
    if (canSubmit) void order.submit(sent);
  };

  const setLine = (id: number, text: string) => {
    form.setValue("quantities", { ...quantities, [id]: text });
    order.clearLineError(id);
    onNotice(null);
  };
  const detail = (key: "poNumber" | "note") => {
    const t = form.text(key);
    return {
      ...t,
      onChangeText: (v: string) => {
        t.onChangeText(v);
        onNotice(null);
      },
    };
  };

  const summaryProps = {
    existing: !!existing,
    chosen: summary.chosen.length,
    totalCents: summary.totalCents,
    minimumCents,
    shortfallCents: summary.shortfallCents,
    locked: frozen,
    held: !!hold && !locked,
    blocked,
    canSubmit,
    saving: order.saving,
    onSubmit: submit,
    money,
    confirmation,
  };
  const banners = (
    <OrderBanners
      date={date}
      existing={existing}
      locked={locked}
      serverClosed={order.serverClosed}
      baseDeadline={baseDeadline}
      deadline={summary.deadline}
      now={now}
      timeZone={timeZone}
      dirty={dirty}
      restored={deviceDraft.restored}
      formError={form.formError}
    />
  );
  const productList = (
    <ProductList
      lines={lines}
      quantities={quantities}
      onChange={setLine}
      lineErrors={order.lineErrors}
      locked={frozen}
      busy={busy}
      dayCutoff={Date.parse(day.cutoffAt)}
      timeZone={timeZone}
      gone={gone}
      money={money}
    />
  );
  const details = (
    <OrderDetailsCard
      date={date}
      poNumber={detail("poNumber")}
      note={detail("note")}
      locked={frozen}
      cancellable={!!existing}
      cancelling={order.cancelling}
      onCancel={order.cancel}
    />
  );

  if (wide) {
    return (
      <Screen testID="order-screen">
        {header}
        {banners}
        <View style={styles.wideGrid}>
          <View style={styles.wideMain}>{productList}</View>
          <View style={styles.wideSide}>
            <OrderSummary variant="card" {...summaryProps} />
            {details}
          </View>
        </View>
      </Screen>
    );
  }
  return (
    <View style={styles.flex}>
      <Screen testID="order-screen">
        {header}
        {banners}
        {productList}
        {details}
      </Screen>
      <OrderSummary variant="footer" {...summaryProps} />
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  wideGrid: { flexDirection: "row", alignItems: "flex-start", gap: space.xl },
  wideMain: { flex: 3, minWidth: 0 },
  wideSide: { flex: 2, gap: space.lg, minWidth: 0 },
});
