import React from "react";
import { Image, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "../../ui/Text";
import { Badge, type BadgeTone } from "../../ui/Badge";
import { BASE_URL } from "../../api/client";
import { useBakeryQuery } from "../../api/bakery";
import { formatMoney } from "../../../shared/money";
import { localeOr } from "../../../shared/format";
import { ALLERGEN_CAUTION, ALLERGEN_LABEL, type AllergenCode } from "../../../shared/allergens";
import { ORDER_STATUS_LABELS, type OrderStatus } from "../../../shared/schemas/orders";
import type { CalendarDayDto } from "../../../shared/schemas/calendar";
import { formatCountdown, isUrgent, msUntil } from "../../ordering/countdown";
import { formatCutoff } from "../../ordering/dates";
import { mayContainLabel } from "../../ordering/allergens";
import { colors, radii, space } from "../../theme";

/** Money in the bakery's currency and locale. */
export function useMoney(): (cents: number) => string {
  const bakery = useBakeryQuery().data;
  const currency = bakery?.currency ?? "USD";
  const locale = localeOr(bakery?.locale);
  return (cents: number) => formatMoney(cents, currency, locale);
}

/** The product's photo, or a drawn stand-in. */
export function ProductPhoto({ url, name, size = 72 }: { url: string | null; name: string; size?: number }) {
  if (url) {
    const src = /^https?:/.test(url) ? url : `${BASE_URL}${url}`;
    return <Image source={{ uri: src }} accessibilityLabel={`Photo of ${name}`} style={[styles.photo, { width: size, height: size }]} resizeMode="cover" />;
  }
  return (
    <View style={[styles.photo, styles.noPhoto, { width: size, height: size }]} accessible accessibilityLabel={`No photo of ${name} yet`}>
      <Feather name="image" size={Math.round(size / 3)} color={colors.muted} />
    </View>
  );
}

/** Allergen chips from the fixed list, then the "may contain" line. */
export function AllergenChips({ allergens, mayContain, testID }: { allergens: readonly AllergenCode[]; mayContain: string; testID?: string }) {
  const traces = mayContainLabel(mayContain);
  if (allergens.length === 0 && !traces) return null;
  return (
    <View style={styles.allergens} testID={testID}>
      {allergens.length ? (
        <View style={styles.chips} accessibilityLabel={`Contains: ${allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}`}>
          {allergens.map((a) => (
            <Badge key={a} label={ALLERGEN_LABEL[a]} tone="neutral" />
          ))}
        </View>
      ) : null}
      {traces ? (
        <AppText variant="small" color="muted">
          {`May contain: ${traces}`}
        </AppText>
      ) : null}
    </View>
  );
}

/** The allergen caution, shown once per screen that lists products. */
export function AllergenCaution() {
  return (
    <View style={styles.caution} testID="allergen-caution">
      <Feather name="info" size={18} color={colors.crustInk} />
      <AppText variant="small" color="ink" style={styles.flex}>
        {ALLERGEN_CAUTION}
      </AppText>
    </View>
  );
}

const ORDER_TONE: Record<OrderStatus, BadgeTone> = { open: "sage", locked: "neutral", delivered: "neutral", cancelled: "danger" };
const BUYER_STATUS_LABEL: Record<OrderStatus, string> = { open: "Order placed", locked: ORDER_STATUS_LABELS.locked, delivered: ORDER_STATUS_LABELS.delivered, cancelled: ORDER_STATUS_LABELS.cancelled };

/** The words the buyer reads for an order's status (the badge's label), for a screen reader too. */
export const buyerStatusLabel = (status: string): string => BUYER_STATUS_LABEL[(status in ORDER_TONE ? status : "open") as OrderStatus];

export function OrderStatusBadge({ status, testID }: { status: string; testID?: string }) {
  const s = (status in ORDER_TONE ? status : "open") as OrderStatus;
  return <Badge label={buyerStatusLabel(s)} tone={ORDER_TONE[s]} testID={testID} />;
}

/** What a delivery date's state is for the buyer, as one badge. */
export function dayStatus(day: CalendarDayDto, now: number): { label: string; tone: BadgeTone } {
  const open = msUntil(day.cutoffAt, now) > 0;
  if (day.order) {
    if (day.order.status === "open" && open) return { label: "Order placed", tone: "sage" };
    if (day.order.status === "delivered") return { label: "Delivered", tone: "neutral" };
    return { label: "Locked for baking", tone: "neutral" };
  }
  if (day.orderable && open) return { label: "Not ordered yet", tone: "amber" };
  if (day.orderable) return { label: "Past the cut-off", tone: "neutral" };
  return { label: day.reasonText ?? "Can't be ordered", tone: "neutral" };
}

export interface CutoffCountdownProps {
  cutoffAt: string;
  now: number;
  timeZone?: string;
  testID?: string;
  /** One line ("Closes in 3 h 12 min") without the cut-off time below. */
  compact?: boolean;
}

/** "Closes in 3 h 12 min" (urgent under an hour), and the cut-off in the bakery's time zone. */
export function CutoffCountdown({ cutoffAt, now, timeZone, testID = "countdown", compact }: CutoffCountdownProps) {
  const ms = msUntil(cutoffAt, now);
  const urgent = isUrgent(ms);
  const closed = ms <= 0;
  const text = formatCountdown(ms);
  const label = text.charAt(0).toUpperCase() + text.slice(1);
  const when = formatCutoff(cutoffAt, timeZone);
  return (
    <View style={styles.countdown}>
      <View
        style={[styles.pill, urgent ? styles.pillUrgent : closed ? styles.pillClosed : styles.pillCalm]}
        accessibilityLiveRegion={urgent ? "polite" : "none"}
        testID={testID}
      >
        <Feather name={urgent ? "alert-triangle" : closed ? "lock" : "clock"} size={15} color={urgent ? colors.dangerInk : closed ? colors.neutralInk : colors.crustInk} />
        <AppText variant="label" color={urgent ? "dangerInk" : closed ? "neutralInk" : "crustInk"} testID={`${testID}-text`}>
          {label}
        </AppText>
      </View>
      {!compact && when ? (
        <AppText variant="small" color="muted" testID={`${testID}-at`}>
          {closed ? `Cut-off was ${when}` : `Cut-off ${when}`}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  photo: { borderRadius: radii.md, backgroundColor: colors.sunken },
  noPhoto: { alignItems: "center", justifyContent: "center", borderWidth: 1, borderColor: colors.border },
  allergens: { gap: space.xs },
  chips: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  caution: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.crustSoft, borderRadius: radii.md, padding: space.md },
  flex: { flex: 1 },
  countdown: { gap: space.xxs, alignItems: "flex-start" },
  pill: { flexDirection: "row", alignItems: "center", gap: space.xs, borderRadius: radii.pill, paddingHorizontal: space.sm + 2, paddingVertical: space.xxs + 1 },
  pillCalm: { backgroundColor: colors.crustSoft },
  pillUrgent: { backgroundColor: colors.dangerSoft },
  pillClosed: { backgroundColor: colors.neutralSoft },
});
