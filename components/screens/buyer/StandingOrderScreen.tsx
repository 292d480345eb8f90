import React, { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { Link } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { TextField } from "../../ui/TextField";
import { FormError, Notice } from "../../ui/FormError";
import { Badge } from "../../ui/Badge";
import { Stepper } from "../../ui/Stepper";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { LinkPressable } from "../../ui/LinkPressable";
import { AppText, Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { useProductsQuery } from "../../api/products";
import { useSaveStandingOrderMutation, useStandingOrderQuery } from "../../api/standing";
import { ApiError, messageOf } from "../../api/client";
import { validate } from "../../forms/errors";
import { addDays, cleanDate, formatDay } from "../../ordering/dates";
import { parseQuantity, quantityProblem } from "../../ordering/quantities";
import { OrderStatusBadge, ProductPhoto, useMoney } from "../ordering/parts";
import { WEEKDAY_LONG, WEEKDAY_SHORT, type Weekday } from "../../../shared/calendar";
import { standingOrderSchema, type StandingOrderDto, type StandingOrderInput } from "../../../shared/schemas/orders";
import type { ProductDto } from "../../../shared/schemas/catalog";
import type { FieldErrors } from "../../../shared/errors";
import { useIsWide } from "../../shell/useIsWide";
import { colors, layout, radii, space } from "../../theme";

const cellKey = (productId: number, weekday: number) => `${productId}:${weekday}`;

/** The weekdays this account gets deliveries: the bakery's days, narrowed to the account's route. */
export function accountWeekdays(bakeryDays: readonly Weekday[], routeDays: readonly Weekday[] | null | undefined): Weekday[] {
  return [...bakeryDays].filter((d) => !routeDays || routeDays.includes(d)).sort((a, b) => a - b);
}

/** "Tue, Thu and Sat". */
export function listWeekdays(days: readonly Weekday[], long = false): string {
  const names = days.map((d) => (long ? WEEKDAY_LONG[d] : WEEKDAY_SHORT[d]));
  if (names.length <= 1) return names.join("");
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}

/** The payload PUT /api/standing-orders gets: only non-zero cells, product by product, weekday by weekday. */
export function standingPayload(p: {
  products: readonly { id: number }[];
  weekdays: readonly Weekday[];
  cells: Record<string, string>;
  startDate: string;
  endDate: string;
  intervalWeeks: 1 | 2;
  skipDates: readonly string[];
  active: boolean;
}): StandingOrderInput {
  const lines: StandingOrderInput["lines"] = [];
  for (const product of p.products) {
    for (const weekday of p.weekdays) {
      const q = parseQuantity(p.cells[cellKey(product.id, weekday)] ?? "");
      if (!Number.isNaN(q) && q > 0) lines.push({ productId: product.id, weekday, quantity: q });
    }
  }
  return {
    startDate: p.startDate.trim(),
    endDate: p.endDate.trim() ? p.endDate.trim() : null,
    intervalWeeks: p.intervalWeeks,
    skipDates: [...new Set(p.skipDates)].sort(),
    lines,
    active: p.active,
  };
}

/** The buyer's standing order: quantities per product per delivery weekday, how often, and the dates it makes. */
export function StandingOrderScreen() {
  const user = useSignedInUser();
  const bakery = useBakeryQuery();
  const standing = useStandingOrderQuery();
  const products = useProductsQuery();
  const settings = useCalendarSettingsQuery();
  const delivery = useAccountDeliveryQuery(user.accountId);

  if (!user.accountId) {
    return (
      <Screen testID="standing-screen">
        <PageHeader title="Standing order" testID="standing-title" />
        <EmptyState icon="link" title="No customer account yet" message="Ask the bakery to link your sign-in to your business's account." />
      </Screen>
    );
  }
  const failed = [standing, products, settings, delivery, bakery].find((q) => q.isError);
  if (failed) {
    return (
      <Screen testID="standing-screen">
        <PageHeader title="Standing order" testID="standing-title" />
        <ErrorState error={failed.error} title="Your standing order didn't load" onRetry={() => failed.refetch()} retrying={failed.isFetching} testID="standing-error" />
      </Screen>
    );
  }
  if (standing.isPending || !products.data || !settings.data || !delivery.data || !bakery.data) {
    return (
      <Screen testID="standing-screen">
        <PageHeader title="Standing order" testID="standing-title" />
        <LoadingState label="Loading your standing order…" testID="standing-loading" />
      </Screen>
    );
  }
  const weekdays = accountWeekdays(settings.data.deliveryWeekdays, delivery.data.routeWeekdays);
  return (
    <StandingForm
      standing={standing.data ?? null}
      products={products.data}
      weekdays={weekdays}
      today={bakery.data.today}
      horizonDays={settings.data.horizonDays}
    />
  );
}

interface StandingFormProps {
  standing: StandingOrderDto | null;
  products: ProductDto[];
  weekdays: Weekday[];
  today: string;
  horizonDays: number;
}

function StandingForm({ standing, products, weekdays, today, horizonDays }: StandingFormProps) {
  const money = useMoney();
  const wide = useIsWide();
  const save = useSaveStandingOrderMutation();
  const [cells, setCells] = useState<Record<string, string>>(() =>
    Object.fromEntries((standing?.lines ?? []).filter((l) => l.quantity > 0).map((l) => [cellKey(l.productId, l.weekday), String(l.quantity)])),
  );
  const [startDate, setStartDate] = useState(standing?.startDate ?? addDays(today, 1));
  const [endDate, setEndDate] = useState(standing?.endDate ?? "");
  const [intervalWeeks, setIntervalWeeks] = useState<1 | 2>(standing?.intervalWeeks ?? 1);
  const [active, setActive] = useState(standing?.active ?? true);
  const [skipDates, setSkipDates] = useState<string[]>(standing?.skipDates ?? []);
  const [newSkip, setNewSkip] = useState("");
  const [skipError, setSkipError] = useState<string | null>(null);
  const [fields, setFields] = useState<FieldErrors>({});
  const [cellErrors, setCellErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);

  const offered = new Set(products.map((p) => p.id));
  const dropped = (standing?.lines ?? []).filter((l) => l.quantity > 0 && (!weekdays.includes(l.weekday) || !offered.has(l.productId)));

  const problems: Record<string, string> = {};
  for (const p of products) {
    for (const d of weekdays) {
      const k = cellKey(p.id, d);
      const problem = quantityProblem(parseQuantity(cells[k] ?? ""), p);
      if (problem) problems[k] = problem;
    }
  }

  const setCell = (k: string, text: string) => {
    setCells((c) => ({ ...c, [k]: text }));
    setSaved(null);
    setCellErrors((e) => {
      if (!e[k]) return e;
      const { [k]: _gone, ...rest } = e;
      return rest;
    });
  };

  const addSkip = () => {
    const d = cleanDate(newSkip);
    if (!d) return setSkipError("Write the date as YYYY-MM-DD, e.g. 2025-12-25.");
    if (d <= today) return setSkipError("Choose a date after today.");
    setSkipError(null);
    setSkipDates((s) => [...new Set([...s, d])].sort());
    setNewSkip("");
    setSaved(null);
  };
  const toggleSkip = (d: string) => {
    setSkipDates((s) => (s.includes(d) ? s.filter((x) => x !== d) : [...s, d].sort()));
    setSaved(null);
  };

  const submit = () => {
    setSaved(null);
    setFormError(null);
    if (Object.keys(problems).length) {
      setFormError("Some quantities need attention: see the boxes marked in red.");
      return;
    }
    const payload = standingPayload({ products, weekdays, cells, startDate, endDate, intervalWeeks, skipDates, active });
    const checked = validate(standingOrderSchema, payload);
    if (!checked.ok) {
      setFields(checked.fields);
      setFormError(null);
      return;
    }
    setFields({});
    setCellErrors({});
    save.mutate(payload, {
      onSuccess: (so) =>
        setSaved(
          !so.active
            ? "Saved. Your standing order is paused: no new orders are made from it."
            : so.lines.length === 0
              ? "Saved. With no quantities set, no orders are made from it."
              : `Saved. Orders are made for the next ${horizonDays} days; dates you changed by hand keep your changes.`,
        ),
      onError: (err) => {
        if (err instanceof ApiError && err.fields) {
          const byCell: Record<string, string> = {};
          const other: FieldErrors = {};
          const rest: string[] = [];
          for (const [key, message] of Object.entries(err.fields)) {
            const m = /^lines\.(\d+)(\.(quantity|weekday|productId))?$/.exec(key);
            const line = m ? payload.lines[Number(m[1])] : undefined;
            if (line) byCell[cellKey(line.productId, line.weekday)] = message;
            else if (["startDate", "endDate", "intervalWeeks"].includes(key) || key.startsWith("skipDates")) other[key.startsWith("skipDates") ? "skipDates" : key] = message;
            else rest.push(message);
          }
          setCellErrors(byCell);
          setFields(other);
          setFormError(rest.length || Object.keys(byCell).length ? err.message : null);
          return;
        }
        setFormError(messageOf(err));
      },
    });
  };

  const chosenDays = weekdays.filter((d) => products.some((p) => parseQuantity(cells[cellKey(p.id, d)] ?? "") > 0));
  const weekTotal = products.reduce(
    (s, p) => s + weekdays.reduce((t, d) => t + Math.max(0, parseQuantity(cells[cellKey(p.id, d)] ?? "") || 0) * p.priceCents, 0),
    0,
  );
  const summary = chosenDays.length
    ? `${intervalWeeks === 2 ? "Every other week" : "Every week"} on ${listWeekdays(chosenDays)}, from ${cleanDate(startDate) ? formatDay(startDate) : "the start date"}${cleanDate(endDate) ? ` until ${formatDay(endDate)}` : ""}.`
    : "No quantities yet: set how much you want on each delivery day.";

  return (
    <Screen testID="standing-screen">
      <PageHeader
        overline="Wholesale ordering"
        title="Standing order"
        subtitle="Your usual quantities for each delivery day. The bakery places them as orders by themselves; you can still change any single date."
        testID="standing-title"
      />
      {!standing ? <Notice tone="info" message="You don't have a standing order yet. Set quantities below and save to start one." testID="standing-none" /> : null}
      {weekdays.length === 0 ? (
        <EmptyState icon="calendar" title="No delivery days for you" message="The bakery hasn't set any delivery days for your account yet. Call them to set your delivery days." testID="standing-no-days" />
      ) : (
        <>
          <View style={styles.summary} testID="standing-summary">
            <Feather name="repeat" size={18} color={colors.crustInk} />
            <View style={styles.flex}>
              <AppText variant="bodyStrong" color="ink">
                {summary}
              </AppText>
              {chosenDays.length ? (
                <AppText variant="small" color="muted" testID="standing-week-total">{`About ${money(weekTotal)} a week at today's prices.`}</AppText>
              ) : null}
            </View>
          </View>
          {dropped.length ? (
            <Notice
              tone="info"
              testID="standing-dropped"
              message={`Some quantities are for days or products you can no longer get and will be removed when you save (${dropped
                .map((l) => `${WEEKDAY_SHORT[l.weekday]}: ${l.quantity}`)
                .join(", ")}).`}
            />
          ) : null}

          <Heading level={2}>Quantities per delivery day</Heading>
          <View style={[styles.cards, wide && styles.cardsWide]}>
            {products.map((p) => (
              <ProductRow key={p.id} wide={wide} product={p} weekdays={weekdays} cells={cells} problems={problems} cellErrors={cellErrors} onChange={setCell} disabled={save.isPending} />
            ))}
          </View>

          <Card title="How often" testID="standing-schedule">
            <ChoiceGroup<"1" | "2">
              label="Repeat"
              testID="standing-interval"
              value={String(intervalWeeks) as "1" | "2"}
              onChange={(v) => {
                setIntervalWeeks(v === "2" ? 2 : 1);
                setSaved(null);
              }}
              error={fields.intervalWeeks}
              choices={[
                { value: "1", label: "Every week" },
                { value: "2", label: "Every other week" },
              ]}
            />
            <View style={styles.pair}>
              <View style={styles.half}>
                <TextField
                  label="Starts on"
                  value={startDate}
                  onChangeText={(t) => {
                    setStartDate(t);
                    setSaved(null);
                  }}
                  error={fields.startDate}
                  placeholder="YYYY-MM-DD"
                  hint={cleanDate(startDate) ? formatDay(startDate) : "Write the date as YYYY-MM-DD."}
                  autoCapitalize="none"
                  autoCorrect={false}
                  inputMode="numeric"
                  testID="standing-start"
                />
              </View>
              <View style={styles.half}>
                <TextField
                  label="Ends on"
                  optional
                  value={endDate}
                  onChangeText={(t) => {
                    setEndDate(t);
                    setSaved(null);
                  }}
                  error={fields.endDate}
                  placeholder="YYYY-MM-DD"
                  hint={cleanDate(endDate) ? formatDay(endDate) : "Leave empty to keep going."}
                  autoCapitalize="none"
                  autoCorrect={false}
                  inputMode="numeric"
                  testID="standing-end"
                />
              </View>
            </View>
            <ChoiceGroup<"on" | "off">
              label="Status"
              testID="standing-active"
              value={active ? "on" : "off"}
              onChange={(v) => {
                setActive(v === "on");
                setSaved(null);
              }}
              choices={[
                { value: "on", label: "On" },
                { value: "off", label: "Paused" },
              ]}
            />
          </Card>

          <Card title="Dates to skip" testID="standing-skips">
            <AppText color="muted">No order is made on these dates (holidays, closures of your own).</AppText>
            {skipDates.length === 0 ? (
              <AppText color="muted" testID="standing-skips-empty">
                No dates skipped.
              </AppText>
            ) : (
              <View style={styles.skipList}>
                {skipDates.map((d) => (
                  <View key={d} style={styles.skipRow} testID={`standing-skip-${d}`}>
                    <AppText variant="bodyStrong" style={styles.flex}>
                      {formatDay(d)}
                    </AppText>
                    <Button label="Remove" small variant="ghost" icon="x" onPress={() => toggleSkip(d)} accessibilityLabel={`Stop skipping ${formatDay(d)}`} testID={`standing-skip-${d}-remove`} />
                  </View>
                ))}
              </View>
            )}
            <View style={styles.addSkip}>
              <View style={styles.flex}>
                <TextField
                  label="Skip a date"
                  value={newSkip}
                  onChangeText={(t) => {
                    setNewSkip(t);
                    setSkipError(null);
                  }}
                  onSubmitEditing={addSkip}
                  placeholder="YYYY-MM-DD"
                  error={skipError ?? fields.skipDates}
                  autoCapitalize="none"
                  autoCorrect={false}
                  inputMode="numeric"
                  testID="standing-skip-date"
                />
              </View>
              <Button label="Add" icon="plus" variant="secondary" onPress={addSkip} testID="standing-skip-add" style={styles.addButton} />
            </View>
          </Card>

          <FormError message={formError} testID="standing-error-message" />
          {saved ? <Notice message={saved} testID="standing-saved" /> : null}
          <Button label="Save standing order" icon="check" onPress={submit} busy={save.isPending} testID="standing-save" block />

          {standing ? <Upcoming standing={standing} skipDates={skipDates} onToggleSkip={toggleSkip} /> : null}
        </>
      )}
    </Screen>
  );
}

interface ProductRowProps {
  product: ProductDto;
  weekdays: Weekday[];
  cells: Record<string, string>;
  problems: Record<string, string>;
  cellErrors: Record<string, string>;
  onChange: (key: string, text: string) => void;
  disabled: boolean;
  wide: boolean;
}

/** One product: its name and a compact row of steppers, one per delivery weekday. */
function ProductRow({ product: p, weekdays, cells, problems, cellErrors, onChange, disabled, wide }: ProductRowProps) {
  const money = useMoney();
  const messages = weekdays
    .map((d) => {
      const k = cellKey(p.id, d);
      const m = cellErrors[k] ?? problems[k];
      return m ? `${WEEKDAY_LONG[d]}: ${m}` : null;
    })
    .filter((m): m is string => !!m);
  const perWeek = weekdays.reduce((s, d) => s + Math.max(0, parseQuantity(cells[cellKey(p.id, d)] ?? "") || 0), 0);
  return (
    <View style={[styles.productCard, wide && styles.productCardWide, messages.length > 0 && styles.productBad]} testID={`standing-product-${p.id}`}>
      <View style={styles.productTop}>
        <ProductPhoto url={p.photoUrl} name={p.name} size={44} />
        <View style={styles.flex}>
          <AppText variant="bodyStrong">{p.name}</AppText>
          <AppText variant="small" color="muted">{`${p.saleUnit} · ${money(p.priceCents)}`}</AppText>
        </View>
        {perWeek > 0 ? <Badge label={`${perWeek} a week`} tone="crust" /> : null}
      </View>
      <View style={styles.days}>
        {weekdays.map((d) => {
          const k = cellKey(p.id, d);
          return (
            <View key={d} style={styles.day}>
              <AppText variant="caption" color="muted" align="center">
                {WEEKDAY_SHORT[d]}
              </AppText>
              <Stepper
                direction="column"
                value={cells[k] ?? ""}
                onChange={(t) => onChange(k, t)}
                min={p.minQuantity}
                max={p.maxQuantity}
                label={`${p.name} on ${WEEKDAY_LONG[d]}s`}
                invalid={!!(cellErrors[k] ?? problems[k])}
                disabled={disabled}
                highlight
                testID={`standing-cell-${p.id}-${d}`}
              />
            </View>
          );
        })}
      </View>
      {messages.map((m) => (
        <AppText key={m} variant="small" color="dangerInk" testID={`standing-product-${p.id}-error`} style={styles.strong}>
          {m}
        </AppText>
      ))}
    </View>
  );
}

/** The dates the standing order makes orders for, marking the ones changed by hand. */
function Upcoming({ standing, skipDates, onToggleSkip }: { standing: StandingOrderDto; skipDates: string[]; onToggleSkip: (d: string) => void }) {
  const edited = standing.upcoming.filter((u) => u.editedByHand).length;
  return (
    <Card title="Coming dates from your standing order" testID="standing-upcoming">
      {standing.upcoming.length === 0 ? (
        <AppText color="muted" testID="standing-upcoming-empty">
          {standing.active ? "No coming dates yet: they appear here as the bakery opens them for ordering." : "Paused: no dates are being made."}
        </AppText>
      ) : (
        <>
          <AppText color="muted">
            {edited
              ? `${edited === 1 ? "1 date was" : `${edited} dates were`} changed by hand: the standing order leaves those as you set them.`
              : "Tap a date to change that one delivery."}
          </AppText>
          <View>
            {standing.upcoming.map((u, i) => {
              const skipping = skipDates.includes(u.date);
              return (
                <View key={u.date} style={[styles.upcomingRow, i > 0 && styles.divider]} testID={`upcoming-${u.date}`}>
                  <Link href={`/buyer/order/${u.date}`} asChild>
                    <LinkPressable accessibilityRole="link" style={styles.upcomingLink} highlightStyle={styles.hover} accessibilityLabel={`Open the order for ${formatDay(u.date)}`}>
                      <AppText variant="bodyStrong">{formatDay(u.date)}</AppText>
                      <View style={styles.badges}>
                        {u.status ? <OrderStatusBadge status={u.status} /> : <Badge label="Not made yet" tone="neutral" />}
                        {u.editedByHand ? <Badge label="Changed by hand" tone="amber" testID={`upcoming-${u.date}-edited`} /> : null}
                        {skipping ? <Badge label="Skipped when you save" tone="danger" /> : null}
                      </View>
                    </LinkPressable>
                  </Link>
                  {u.status === "locked" || u.status === "delivered" ? null : (
                  <Pressable
                    accessibilityRole="button"
                    accessibilityLabel={skipping ? `Don't skip ${formatDay(u.date)}` : `Skip ${formatDay(u.date)}`}
                    onPress={() => onToggleSkip(u.date)}
                    style={({ pressed }) => [styles.skipButton, pressed && styles.hover]}
                    testID={`upcoming-${u.date}-skip`}
                  >
                    <AppText variant="label" color="crust">
                      {skipping ? "Undo" : "Skip"}
                    </AppText>
                  </Pressable>
                  )}
                </View>
              );
            })}
          </View>
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  strong: { fontFamily: "Nunito_700Bold" },
  summary: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.surface, borderRadius: radii.md, padding: space.md, borderWidth: 2, borderColor: colors.crust },
  cards: { gap: space.md },
  cardsWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
  productCardWide: { width: "32%", minWidth: 290 },
  productCard: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: space.md, gap: space.sm },
  productBad: { borderColor: colors.danger, borderWidth: 2 },
  productTop: { flexDirection: "row", alignItems: "center", gap: space.md },
  days: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  day: { width: 52, alignItems: "center", gap: space.xxs },
  pair: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  half: { flexGrow: 1, flexBasis: 200 },
  skipList: { gap: space.xs },
  skipRow: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: layout.minTouch },
  addSkip: { flexDirection: "row", alignItems: "flex-end", gap: space.sm },
  addButton: { marginBottom: 2 },
  upcomingRow: { flexDirection: "row", alignItems: "center", gap: space.sm },
  upcomingLink: { flex: 1, minHeight: layout.minTouch + 8, paddingVertical: space.sm, gap: space.xs, justifyContent: "center", borderRadius: radii.sm },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  skipButton: { minHeight: layout.minTouch, minWidth: layout.minTouch + 16, alignItems: "center", justifyContent: "center", borderRadius: radii.pill, paddingHorizontal: space.md },
  hover: { backgroundColor: colors.rowHover },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
