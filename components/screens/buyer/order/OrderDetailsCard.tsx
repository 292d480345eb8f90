import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../../ui/Button";
import { Card } from "../../../ui/Card";
import { TextField } from "../../../ui/TextField";
import { AppText } from "../../../ui/Text";
import { formatDayLong } from "../../../ordering/dates";
import { colors, radii, space } from "../../../theme";

type TextProps = { value: string; onChangeText: (value: string) => void; error: string | undefined };

export interface OrderDetailsCardProps {
  date: string;
  /** The form's PO number and note inputs (`form.text(...)`). */
  poNumber: TextProps;
  note: TextProps;
  locked: boolean;
  /** A saved order that is still open: it can be canceled here. */
  cancellable: boolean;
  cancelling: boolean;
  /** Cancel the order; resolves false when that failed. */
  onCancel: () => Promise<boolean>;
}

/** PO number and note, and (for a saved open order) canceling it after a confirmation. */
export function OrderDetailsCard({ date, poNumber, note, locked, cancellable, cancelling, onCancel }: OrderDetailsCardProps) {
  const [confirming, setConfirming] = useState(false);
  return (
    <Card title="Order details" testID="order-details">
      <TextField
        label="PO number"
        optional
        {...poNumber}
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
        {...note}
        editable={!locked}
        maxLength={500}
        multiline
        hint="Delivery instructions or anything the bakers should know."
        testID="order-note"
      />
      {cancellable && !locked ? (
        confirming ? (
          <View style={styles.confirm} testID="order-cancel-confirm-box">
            <AppText variant="bodyStrong" color="dangerInk">
              {`Cancel your order for ${formatDayLong(date)}?`}
            </AppText>
            <AppText color="ink">Nothing will be baked or delivered for this date. You can order again until the cut-off.</AppText>
            <View style={styles.buttons}>
              <Button
                label="Yes, cancel order"
                variant="danger"
                busy={cancelling}
                onPress={() => void onCancel().then((ok) => ok || setConfirming(false))}
                testID="order-cancel-confirm"
              />
              <Button label="Keep the order" variant="secondary" onPress={() => setConfirming(false)} testID="order-cancel-keep" />
            </View>
          </View>
        ) : (
          <Button label="Cancel this order" icon="x-circle" variant="ghost" onPress={() => setConfirming(true)} testID="order-cancel" />
        )
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
