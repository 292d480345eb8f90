import React, { useMemo, useRef, useState } from "react";
import { StyleSheet, View } from "react-native";
import { useQueryClient } from "@tanstack/react-query";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { FormError, Notice } from "../../ui/FormError";
import { Badge } from "../../ui/Badge";
import { Stepper } from "../../ui/Stepper";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { AppText, Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { calendarKeys, useCalendarQuery, useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { useProductsQuery } from "../../api/products";
import { useCancelOrderMutation, useCreateOrderMutation, useOrderQuery, useUpdateOrderMutation } from "../../api/orders";
import { ApiError, messageOf } from "../../api/client";
import { useServerNow } from "../../ordering/useServerNow";
import { msUntil } from "../../ordering/countdown";
import { formatCutoff, formatDay, formatDayLong, relativeDay } from "../../ordering/dates";
import { parseQuantity, productsLabel, quantityProblem, shortfall } from "../../ordering/quantities";
import { IdempotencyKeeper } from "../../ordering/idempotency";
import { clearDraft, draftMatches, readDraft, writeDraft, type DraftOwner, type OrderDraft } from "../../ordering/draft";
import { useIsWide } from "../../shell/useIsWide";
import { accountStatusNote } from "./BuyerHome";
import { quantityText } from "../../../shared/quantity";
import { AllergenCaution, AllergenChips, CutoffCountdown, OrderStatusBadge, ProductPhoto, useMoney } from "../ordering/parts";
import { cutoffFor, isCalendarDate, type CalendarSettings } from "../../../shared/calendar";
import type { CalendarDayDto, CalendarSettingsDto } from "../../../shared/schemas/calendar";
import type { ProductDto } from "../../../shared/schemas/catalog";
import type { OrderDto } from "../../../shared/schemas/orders";
import type { FieldErrors } from "../../../shared/errors";
import { colors, layout, radii, shadow, space } from "../../theme";

/** One delivery date: place an order, change it, cancel it; read-only once it is locked for baking. */
export function OrderScreen({ date }: { date: string }) {
  const user = useSignedInUser();
  const valid = isCalendarDate(date);
  const qc = useQueryClient();
  const bakery = useBakeryQuery();
  const calendar = useCalendarQuery(valid ? { from: date, to: date } : null);
  const products = useProductsQuery();
  const delivery = useAccountDeliveryQuery(user.accountId);
  const settings = useCalendarSettingsQuery();
  const account = useAccountQuery(user.accountId);
  const day = calendar.data?.[0];
  const order = useOrderQuery(day?.order?.id ?? null);
  const [notice, setNotice] = useState<{ text: string; tone: "success" | "info" } | null>(null);
  const now = useServerNow();

  if (!valid) {
    return (
      <Screen testID="order-screen">
        <BackHome />
        <EmptyState icon="help-circle" title="That isn't a date" message="Open a delivery date from your home screen." testID="order-bad-date" />
      </Screen>
    );
  }
  const failed = [calendar, products, order].find((q) => q.isError);
  if (failed) {
    return (
      <Screen testID="order-screen">
        <BackHome />
        <PageHeader overline="Delivery" title={formatDayLong(date)} testID="order-title" />
        <ErrorState error={failed.error} title="This order didn't load" onRetry={() => failed.refetch()} retrying={failed.isFetching} testID="order-error" />
      </Screen>
    );
  }
  if (!day || !products.data || (day.order && order.isPending)) {
    return (
      <Screen testID="order-screen">
        <BackHome />
        <LoadingState label="Loading the order…" testID="order-loading" />
      </Screen>
    );
  }

  const existing = order.data && order.data.status !== "cancelled" && day.order ? order.data : null;
  const timeZone = bakery.data?.timeZone ?? settings.data?.timeZone;
  const today = bakery.data?.today;
  const rel = relativeDay(date, today);

  const header = (
    <>
      <BackHome />
      <PageHeader overline={rel ? `Delivery · ${rel}` : "Delivery"} title={formatDayLong(date)} testID="order-title" />
      {notice ? <Notice message={notice.text} tone={notice.tone} testID="order-notice" /> : null}
      {account.data && accountStatusNote(account.data) ? <Notice tone="info" message={accountStatusNote(account.data) ?? ""} testID="order-account-note" /> : null}
    </>
  );

  if (existing && existing.status !== "open") {
    return (
      <Screen testID="order-screen">
        {header}
        <ReadOnlyOrder order={existing} timeZone={timeZone} />
      </Screen>
    );
  }
  if (!existing && !day.orderable) {
    const closed = day.reason === "past_cutoff";
    return (
      <Screen testID="order-screen">
        {header}
        <EmptyState
          icon={closed ? "lock" : "calendar"}
          title={closed ? "Ordering for this date has closed" : "This date can't be ordered"}
          message={
            closed
              ? `The cut-off was ${formatCutoff(day.cutoffAt, timeZone)}. No order was placed. If something has gone wrong, call the bakery.`
              : `${day.reasonText ?? "The bakery doesn't take orders for this date."}.`
          }
          action={<LinkButton href="/buyer" label="See your delivery dates" icon="calendar" variant="secondary" />}
          testID="order-not-orderable"
        />
      </Screen>
    );
  }

  return (
    <OrderForm
      key={existing ? `order-${existing.id}` : "new"}
      date={date}
      day={day}
      products={products.data}
      existing={existing}
      minimumCents={delivery.data?.minimumOrderCents ?? 0}
      settings={settings.data}
      timeZone={timeZone}
      now={now}
      header={header}
      draftOwner={user.accountId ? { userId: user.id, accountId: user.accountId } : null}
      onNotice={setNotice}
      onExists={() => {
        setNotice({ text: "There's already an order for this date (placed on another device or by the bakery). It's shown below: make your changes there.", tone: "info" });
        void qc.invalidateQueries({ queryKey: calendarKeys.all });
      }}
    />
  );
}

function BackHome() {
  return <TextLink href="/buyer" label="‹ Delivery dates" testID="order-back" />;
}

interface OrderFormProps {
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
  onNotice: (n: { text: string; tone: "success" | "info" } | null) => void;
  onExists: () => void;
}

const initialQuantities = (order: OrderDto | null): Record<number, string> =>
  Object.fromEntries((order?.lines ?? []).map((l) => [l.productId, String(l.quantity)]));

/** The product's own cut-off for this date (products that need more notice close earlier). */
function productCutoff(date: string, day: CalendarDayDto, p: ProductDto, settings?: CalendarSettingsDto): number {
  const dayCutoff = Date.parse(day.cutoffAt);
  if (!settings || p.leadDays === null || p.leadDays <= settings.leadDays) return dayCutoff;
  const s: Pick<CalendarSettings, "timeZone" | "cutoffTime" | "leadDays"> = settings;
  return Math.min(dayCutoff, cutoffFor(date, s, p.leadDays).toMillis());
}

/** A draft kept on this device for the date, unless it says what the bakery already has (then it is dropped). */
function restorableDraft(owner: DraftOwner | null, date: string, existing: OrderDto | null, closed: boolean): OrderDraft | null {
  if (!owner) return null;
  const draft = readDraft(owner, date);
  if (!draft) return null;
  if (closed || (existing && draftMatches(draft, initialQuantities(existing), existing.poNumber ?? "", existing.note ?? ""))) {
    clearDraft(owner, date);
    return null;
  }
  return draft;
}

/** A failure after which the same order can simply be sent again: no answer, or the server briefly unavailable. */
const isTransient = (err: unknown) => err instanceof ApiError && (err.status === 0 || err.status >= 500);

function OrderForm({ date, day, products, existing, minimumCents, settings, timeZone, now, header, draftOwner, onNotice, onExists }: OrderFormProps) {
  const wide = useIsWide();
  const money = useMoney();
  const create = useCreateOrderMutation();
  const update = useUpdateOrderMutation(existing?.id ?? 0);
  const cancel = useCancelOrderMutation(existing?.id ?? 0);
  const keeper = useRef(new IdempotencyKeeper()).current;

  const [initial] = useState(() => ({ qty: initialQuantities(existing), po: existing?.poNumber ?? "", note: existing?.note ?? "" }));
  // An order that could not be saved earlier on this device comes back as it was typed.
  const [restored, setRestored] = useState(() => restorableDraft(draftOwner, date, existing, msUntil(existing ? existing.cutoffAt : day.cutoffAt, now) <= 0));
  const [qty, setQty] = useState<Record<number, string>>(restored?.quantities ?? initial.qty);
  const [po, setPo] = useState(restored?.poNumber ?? initial.po);
  const [note, setNote] = useState(restored?.note ?? initial.note);
  const [lineErrors, setLineErrors] = useState<Record<number, string>>({});
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [serverClosed, setServerClosed] = useState<string | null>(null);
  const [confirmCancel, setConfirmCancel] = useState(false);
  // Placed: the page is about to switch to the saved order; no second submission meanwhile.
  const [placed, setPlaced] = useState(false);

  const busy = create.isPending || update.isPending || cancel.isPending;
  const baseDeadline = existing ? existing.cutoffAt : day.cutoffAt;
  const closedByClock = msUntil(baseDeadline, now) <= 0;
  const locked = closedByClock || !!serverClosed;

  const offered = new Set(products.map((p) => p.id));
  const gone = (existing?.lines ?? []).filter((l) => !offered.has(l.productId));

  const lines = useMemo(
    () =>
      products.map((p) => {
        const q = parseQuantity(qty[p.id] ?? "");
        const cutoff = productCutoff(date, day, p, settings);
        const inOrder = existing?.lines.some((l) => l.productId === p.id) ?? false;
        const tooLate = !inOrder && cutoff <= now;
        return { p, q, cutoff, tooLate, problem: quantityProblem(q, p) };
      }),
    [products, qty, date, day, settings, existing, now],
  );
  const chosen = lines.filter((l) => !Number.isNaN(l.q) && l.q > 0);
  const total = chosen.reduce((s, l) => s + l.q * l.p.priceCents, 0);
  const short = shortfall(total, minimumCents);
  const lateChosen = chosen.filter((l) => l.tooLate);
  const problems = lines.filter((l) => l.problem).length + lateChosen.length;
  // The countdown follows the earliest cut-off among what is chosen (while it is still ahead).
  const deadline = chosen.reduce((min, l) => (l.cutoff > now && l.cutoff < min ? l.cutoff : min), Date.parse(baseDeadline));
  const dirty =
    JSON.stringify(Object.fromEntries(chosen.map((l) => [l.p.id, l.q]))) !==
      JSON.stringify(Object.fromEntries(Object.entries(initial.qty).map(([k, v]) => [Number(k), Number(v)]))) ||
    po.trim() !== initial.po.trim() ||
    note.trim() !== initial.note.trim() ||
    gone.length > 0;

  let blocked: string | null = null;
  if (locked) blocked = null;
  else if (chosen.length === 0) blocked = existing ? "To call off this delivery, use “Cancel this order” below." : "Choose at least one product.";
  else if (problems > 0) blocked = "Fix the quantities marked in red first.";
  else if (short > 0) blocked = null;
  const canSubmit = !placed && !locked && !busy && chosen.length > 0 && problems === 0 && short === 0 && (!existing || dirty);

  const setLine = (id: number, text: string) => {
    setQty((s) => ({ ...s, [id]: text }));
    setLineErrors((e) => {
      if (!e[id]) return e;
      const { [id]: _dropped, ...rest } = e;
      return rest;
    });
    onNotice(null);
  };

  const keepDraft = () => {
    if (draftOwner) writeDraft(draftOwner, date, { quantities: qty, poNumber: po, note, orderId: existing?.id ?? null });
  };
  const dropDraft = () => {
    if (draftOwner) clearDraft(draftOwner, date);
    setRestored(null);
  };

  const fail = (sent: { productId: number; quantity: number }[]) => (err: unknown) => {
    if (isTransient(err)) {
      // Nothing reached the bakery: keep the order on the device, so leaving this screen loses nothing.
      keepDraft();
      const e = err as ApiError;
      setFormError(
        e.code === "network_error"
          ? `${e.message} Nothing was lost: your order is kept on this device; press the button again to send it.`
          : `${e.message} Your order is kept on this device: press the button again to send it.`,
      );
      return;
    }
    if (err instanceof ApiError) {
      if (err.code === "cutoff_passed" || err.code === "date_not_orderable" || err.code === "order_closed") {
        const at = typeof err.details.cutoffAt === "string" ? Date.parse(err.details.cutoffAt) : Number.NaN;
        if (err.code === "cutoff_passed" && !existing && at < Date.parse(day.cutoffAt) && msUntil(day.cutoffAt, now) > 0) {
          setFormError(`${err.message} Some products need more notice: take them off to order the rest.`);
          return;
        }
        setServerClosed(err.message);
        setFormError(null);
        return;
      }
      if (err.code === "order_exists") {
        onExists();
        return;
      }
      if (err.fields) {
        const byLine: Record<number, string> = {};
        const other: FieldErrors = {};
        const rest: string[] = [];
        for (const [key, message] of Object.entries(err.fields)) {
          const m = /^lines\.(\d+)\.(quantity|productId)$/.exec(key);
          if (m && sent[Number(m[1])]) byLine[sent[Number(m[1])].productId] = message;
          else if (key === "poNumber" || key === "note") other[key] = message;
          else rest.push(message);
        }
        setLineErrors(byLine);
        setFields(other);
        const named = Object.keys(byLine).map((id) => products.find((p) => p.id === Number(id))?.name).filter(Boolean);
        setFormError(
          rest.length
            ? err.message
            : named.length === 1
              ? `Check ${named[0]}: ${Object.values(byLine)[0]}`
              : named.length > 1
                ? "Some products need attention: see the ones marked in red."
                : null,
        );
        return;
      }
    }
    setFormError(messageOf(err));
  };

  const submit = () => {
    if (!canSubmit) return;
    setFormError(null);
    setFields({});
    setLineErrors({});
    onNotice(null);
    const sent = chosen.map((l) => ({ productId: l.p.id, quantity: l.q }));
    if (existing) {
      update.mutate(
        { lines: sent, poNumber: po.trim(), note: note.trim() },
        {
          onSuccess: (o) => {
            dropDraft();
            onNotice({ text: `Changes saved. Your order for ${formatDay(date)} is now ${money(o.totalCents)}.`, tone: "success" });
          },
          onError: fail(sent),
        },
      );
      return;
    }
    const input = { deliveryDate: date, lines: sent, ...(po.trim() ? { poNumber: po.trim() } : {}), ...(note.trim() ? { note: note.trim() } : {}) };
    create.mutate(
      { input, idempotencyKey: keeper.keyFor(input) },
      {
        onSuccess: (o) => {
          keeper.reset();
          dropDraft();
          setPlaced(true);
          onNotice({ text: `Order placed for ${formatDayLong(date)}: ${o.lines.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ")}, ${money(o.totalCents)}.`, tone: "success" });
        },
        onError: fail(sent),
      },
    );
  };

  const doCancel = () => {
    setFormError(null);
    cancel.mutate(undefined, {
      onSuccess: () => {
        dropDraft();
        onNotice({ text: `Your order for ${formatDayLong(date)} is canceled. You can still order for this date until the cut-off.`, tone: "info" });
      },
      onError: (err) => {
        setConfirmCancel(false);
        if (err instanceof ApiError && (err.code === "cutoff_passed" || err.code === "order_closed")) setServerClosed(err.message);
        else setFormError(messageOf(err));
      },
    });
  };

  const minimumHint =
    minimumCents > 0 ? (
      <AppText variant="small" color={short > 0 ? "dangerInk" : "muted"} testID="order-minimum" style={short > 0 ? styles.strong : undefined}>
        {short > 0
          ? `Add ${money(short)} more to reach the ${money(minimumCents)} minimum.`
          : total > 0
            ? `The ${money(minimumCents)} minimum order is met.`
            : `Minimum order ${money(minimumCents)}.`}
      </AppText>
    ) : null;

  const totalText = (
    <View>
      <AppText variant="caption" color="muted" testID="order-items">
        {chosen.length > 0 ? productsLabel(chosen.length) : "Nothing chosen yet"}
      </AppText>
      <AppText variant="title" testID="order-total" accessibilityLabel={`Order total ${money(total)}`}>
        {money(total)}
      </AppText>
    </View>
  );

  const submitButton = (
    <Button
      label={locked ? "Ordering closed" : existing ? "Save changes" : "Place order"}
      icon={locked ? "lock" : existing ? "check" : "shopping-bag"}
      onPress={submit}
      disabled={!canSubmit}
      busy={create.isPending || update.isPending}
      testID="order-submit"
      block={wide}
    />
  );

  const blockedText = blocked ? (
    <AppText variant="small" color="muted" testID="order-blocked">
      {blocked}
    </AppText>
  ) : null;

  const details = (
    <Card title="Order details" testID="order-details">
      <TextField
        label="PO number"
        optional
        value={po}
        onChangeText={(t) => {
          setPo(t);
          onNotice(null);
        }}
        error={fields.poNumber}
        editable={!locked}
        maxLength={40}
        autoCapitalize="characters"
        autoCorrect={false}
        hint="Your purchase-order reference, printed on the invoice."
        testID="order-po"
      />
      <TextField
        label="Note for the bakery"
        optional
        value={note}
        onChangeText={(t) => {
          setNote(t);
          onNotice(null);
        }}
        error={fields.note}
        editable={!locked}
        maxLength={500}
        multiline
        hint="Delivery instructions or anything the bakers should know."
        testID="order-note"
      />
      {existing && !locked ? (
        confirmCancel ? (
          <View style={styles.confirm} testID="order-cancel-confirm-box">
            <AppText variant="bodyStrong" color="dangerInk">
              {`Cancel your order for ${formatDayLong(date)}?`}
            </AppText>
            <AppText color="ink">Nothing will be baked or delivered for this date. You can order again until the cut-off.</AppText>
            <View style={styles.buttons}>
              <Button label="Yes, cancel order" variant="danger" busy={cancel.isPending} onPress={doCancel} testID="order-cancel-confirm" />
              <Button label="Keep the order" variant="secondary" onPress={() => setConfirmCancel(false)} testID="order-cancel-keep" />
            </View>
          </View>
        ) : (
          <Button label="Cancel this order" icon="x-circle" variant="ghost" onPress={() => setConfirmCancel(true)} testID="order-cancel" />
        )
      ) : null}
    </Card>
  );

  const banners = (
    <>
      <View style={styles.statusRow}>
        {existing ? <OrderStatusBadge status={existing.status} testID="order-status" /> : <Badge label="New order" tone="amber" testID="order-status" />}
        {!locked ? <CutoffCountdown cutoffAt={new Date(deadline).toISOString()} now={now} timeZone={timeZone} testID="order-countdown" /> : null}
      </View>
      {locked ? (
        <View style={styles.closed} accessibilityRole="alert" testID="order-closed">
          <AppText variant="bodyStrong" color="dangerInk">
            {serverClosed ?? `Ordering for ${formatDayLong(date)} closed at the cut-off, ${formatCutoff(baseDeadline, timeZone)}.`}
          </AppText>
          <AppText color="ink">
            {existing
              ? dirty
                ? "Your unsent changes were not saved. The order below is what the bakery has."
                : "Your order is locked for baking and will be delivered as it stands."
              : "No order was placed for this date. If something has gone wrong, call the bakery."}
          </AppText>
        </View>
      ) : null}
      {existing?.source === "standing" ? (
        <Notice
          tone="info"
          testID="order-from-standing"
          message={
            existing.editedByHand
              ? "Made from your standing order and changed by hand: later changes to the standing order won't touch this date."
              : "Made from your standing order. Changing it here changes this date only."
          }
        />
      ) : null}
      {restored && !locked ? (
        <Notice
          tone="info"
          testID="order-draft-restored"
          message={`Your order from ${formatCutoff(restored.savedAt, timeZone)} didn't reach the bakery; it was kept on this device and is filled in below. ${existing ? "Press “Save changes” to send it." : "Press “Place order” to send it."}`}
        />
      ) : null}
      <FormError message={formError} testID="order-error-message" />
    </>
  );

  const productList = (
    <View style={styles.products}>
      <Heading level={2}>Products</Heading>
      {products.length === 0 ? (
        <EmptyState icon="shopping-bag" title="Nothing on offer right now" message="The bakery has no products to order at the moment." testID="order-no-products" />
      ) : (
        lines.map((l) => (
          <ProductLine
            key={l.p.id}
            product={l.p}
            text={qty[l.p.id] ?? ""}
            onChange={(t) => setLine(l.p.id, t)}
            disabled={locked || busy || (l.tooLate && !(l.q > 0))}
            problem={lineErrors[l.p.id] ?? l.problem ?? (l.tooLate && l.q > 0 ? "Too late for this date: take it off to order the rest." : null)}
            lateNote={l.tooLate ? `Needs ordering by ${formatCutoff(new Date(l.cutoff).toISOString(), timeZone)}, so it can't be added for this date.` : l.cutoff < Date.parse(day.cutoffAt) && !locked ? `Needs more notice: order it by ${formatCutoff(new Date(l.cutoff).toISOString(), timeZone)}.` : null}
            lineTotal={!Number.isNaN(l.q) && l.q > 0 ? money(l.q * l.p.priceCents) : null}
            money={money}
          />
        ))
      )}
      {products.length ? <AllergenCaution /> : null}
      {gone.length ? (
        <Notice
          tone="info"
          testID="order-gone-lines"
          message={`No longer offered, and taken off when you save: ${gone.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ")}.`}
        />
      ) : null}
    </View>
  );

  if (wide) {
    return (
      <Screen testID="order-screen">
        {header}
        {banners}
        <View style={styles.wideGrid}>
          <View style={styles.wideMain}>{productList}</View>
          <View style={styles.wideSide}>
            <Card title={existing ? "Your order" : "Your new order"} testID="order-summary">
              {totalText}
              {minimumHint}
              {submitButton}
              {blockedText}
            </Card>
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
      <View style={styles.footer} testID="order-summary">
        <View style={styles.footerRow}>
          {totalText}
          {submitButton}
        </View>
        {blocked && short === 0 ? blockedText : minimumHint}
      </View>
    </View>
  );
}

interface ProductLineProps {
  product: ProductDto;
  text: string;
  onChange: (text: string) => void;
  disabled: boolean;
  problem: string | null;
  lateNote: string | null;
  lineTotal: string | null;
  money: (c: number) => string;
}

function ProductLine({ product: p, text, onChange, disabled, problem, lateNote, lineTotal, money }: ProductLineProps) {
  const discounted = p.priceCents < p.listPriceCents;
  return (
    <View style={[styles.product, lineTotal && styles.productOn, problem && styles.productBad]} testID={`product-${p.id}`}>
      <View style={styles.productTop}>
        <ProductPhoto url={p.photoUrl} name={p.name} size={64} />
        <View style={styles.productText}>
          <AppText variant="bodyStrong">{p.name}</AppText>
          <AppText variant="small" color="muted">
            {p.saleUnit}
          </AppText>
          <View style={styles.priceLine}>
            <AppText variant="label" testID={`product-${p.id}-price`}>
              {money(p.priceCents)}
            </AppText>
            {discounted ? (
              <>
                <AppText variant="small" color="muted" style={styles.struck} accessibilityLabel={`List price ${money(p.listPriceCents)}`}>
                  {money(p.listPriceCents)}
                </AppText>
                <AppText variant="small" color="sageInk">
                  your price
                </AppText>
              </>
            ) : null}
          </View>
        </View>
      </View>
      <AllergenChips allergens={p.allergens} mayContain={p.mayContain} testID={`product-${p.id}-allergens`} />
      {lateNote ? (
        <AppText variant="small" color="muted">
          {lateNote}
        </AppText>
      ) : null}
      <View style={styles.stepRow}>
        <Stepper
          value={text}
          onChange={onChange}
          min={p.minQuantity}
          max={p.maxQuantity}
          label={p.name}
          disabled={disabled}
          invalid={!!problem}
          testID={`qty-${p.id}`}
        />
        <View style={styles.lineRight}>
          {lineTotal ? (
            <AppText variant="bodyStrong" testID={`line-${p.id}-total`}>
              {lineTotal}
            </AppText>
          ) : null}
          <AppText variant="caption" color="muted">
            {p.minQuantity > 1 ? `${p.minQuantity} to ${p.maxQuantity}` : `Up to ${p.maxQuantity}`}
          </AppText>
        </View>
      </View>
      {problem ? (
        <AppText variant="small" color="dangerInk" style={styles.strong} testID={`line-${p.id}-error`} accessibilityLiveRegion="polite">
          {problem}
        </AppText>
      ) : null}
    </View>
  );
}

/** A locked or delivered order: what the bakery has, line by line. */
function ReadOnlyOrder({ order, timeZone }: { order: OrderDto; timeZone?: string }) {
  const money = useMoney();
  return (
    <>
      <View style={styles.statusRow}>
        <OrderStatusBadge status={order.status} testID="order-status" />
      </View>
      <Notice
        tone="info"
        testID="order-readonly"
        message={
          order.status === "delivered"
            ? "This order has been delivered."
            : `This order is locked for baking: the cut-off was ${formatCutoff(order.cutoffAt, timeZone)}. Call the bakery if something has to change.`
        }
      />
      <Card title="What's coming" testID="order-lines">
        {order.lines.map((l, i) => (
          <View key={l.productId} style={[styles.receiptLine, i > 0 && styles.divider]}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{l.productName}</AppText>
              <AppText variant="small" color="muted">{`${quantityText(l.quantity, l)} · ${money(l.unitPriceCents)} per ${l.saleUnit}`}</AppText>
            </View>
            <AppText variant="bodyStrong">{money(l.lineTotalCents)}</AppText>
          </View>
        ))}
        <View style={[styles.receiptLine, styles.divider]}>
          <AppText variant="heading">Total</AppText>
          <AppText variant="heading" testID="order-total">
            {money(order.totalCents)}
          </AppText>
        </View>
        {order.poNumber ? <AppText color="muted">{`PO number: ${order.poNumber}`}</AppText> : null}
        {order.note ? <AppText color="muted">{`Note: ${order.note}`}</AppText> : null}
      </Card>
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  strong: { fontFamily: "Nunito_700Bold" },
  statusRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  closed: { gap: space.xs, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  products: { gap: space.md },
  product: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
    padding: space.md,
    gap: space.sm,
    ...shadow.card,
  },
  productOn: { borderColor: colors.crust, borderWidth: 2 },
  productBad: { borderColor: colors.danger, borderWidth: 2 },
  productTop: { flexDirection: "row", gap: space.md },
  productText: { flex: 1, gap: space.xxs },
  priceLine: { flexDirection: "row", flexWrap: "wrap", alignItems: "baseline", gap: space.sm },
  struck: { textDecorationLine: "line-through" },
  stepRow: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md, flexWrap: "wrap" },
  lineRight: { alignItems: "flex-end", gap: space.xxs },
  footerRow: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md },
  footer: {
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.border,
    paddingHorizontal: space.lg,
    paddingTop: space.sm,
    paddingBottom: space.md,
    gap: space.sm,
    ...shadow.card,
  },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  wideGrid: { flexDirection: "row", alignItems: "flex-start", gap: space.xl },
  wideMain: { flex: 3, minWidth: 0 },
  wideSide: { flex: 2, gap: space.lg, minWidth: 0 },
  receiptLine: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md, paddingVertical: space.sm, minHeight: layout.minTouch },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
