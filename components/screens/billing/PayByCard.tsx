import React from "react";
import { StyleSheet, View } from "react-native";
import { useQueryClient } from "@tanstack/react-query";
import { Button, type ButtonVariant } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { ApiError, messageOf } from "../../api/client";
import { invoiceKeys, useCheckoutMutation } from "../../api/invoices";
import { space } from "../../theme";

export interface PayByCardProps {
  invoiceId: number;
  label?: string;
  variant?: ButtonVariant;
  testID?: string;
}

/**
 * "Pay by card": asks the server for a hosted checkout for what is due and goes to the card processor's
 * page. When card payments can't be reached (503) the message says so and the button offers another try.
 */
export function PayByCard({ invoiceId, label = "Pay by card", variant = "primary", testID = "pay-by-card" }: PayByCardProps) {
  const qc = useQueryClient();
  const checkout = useCheckoutMutation(invoiceId);
  const err = checkout.error;
  const unavailable = err instanceof ApiError && err.code === "payments_unavailable";
  const pay = () =>
    checkout.mutate(undefined, {
      onError: (e) => {
        // Already paid (or void): show the invoice as it is now.
        if (e instanceof ApiError && e.status === 409) void qc.invalidateQueries({ queryKey: invoiceKeys.all });
      },
    });
  return (
    <View style={styles.wrap}>
      <Button
        label={unavailable ? "Try again" : label}
        icon="credit-card"
        variant={variant}
        busy={checkout.isPending || checkout.isSuccess}
        onPress={pay}
        testID={testID}
        accessibilityLabel={unavailable ? `Try the card payment again` : undefined}
      />
      {checkout.isSuccess ? <Notice tone="info" message="Opening the secure card payment page…" testID={`${testID}-opening`} /> : null}
      <FormError message={err ? messageOf(err) : null} testID={`${testID}-error`} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm, alignItems: "flex-start" },
});
