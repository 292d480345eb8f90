import React from "react";
import { StyleSheet, View } from "react-native";
import { Badge } from "../../../ui/Badge";
import { FormError, Notice } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { CutoffCountdown } from "../../ordering/CutoffCountdown";
import { OrderStatusBadge } from "../../ordering/OrderStatusBadge";
import { formatCutoff, formatDayLong } from "../../../ordering/dates";
import type { OrderDraft } from "../../../ordering/deviceDraft";
import type { OrderDto } from "../../../../shared/schemas/orders";
import { colors, radii, space } from "../../../theme";

export interface OrderBannersProps {
  date: string;
  existing: OrderDto | null;
  locked: boolean;
  /** The server's words when it refused because ordering has closed. */
  serverClosed: string | null;
  /** The date's cut-off (ISO 8601), for the closed message. */
  baseDeadline: string;
  /** The countdown's deadline (ms). */
  deadline: number;
  now: number;
  timeZone?: string;
  dirty: boolean;
  restored: OrderDraft | null;
  formError: string | null;
}

/** Above the products: the order's status and countdown, why it is closed, where it came from, and errors. */
export function OrderBanners({ date, existing, locked, serverClosed, baseDeadline, deadline, now, timeZone, dirty, restored, formError }: OrderBannersProps) {
  return (
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
}

const styles = StyleSheet.create({
  statusRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  closed: { gap: space.xs, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
});
