import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "../../ui/Text";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { FormError } from "../../ui/FormError";
import { messageOf } from "../../api/client";
import { useCheckoutMutation, useInvoicesQuery } from "../../api/invoices";
import { money } from "../billing/parts";
import { CallBakery } from "../common/CallBakery";
import { invoicesLabel } from "../billing/InvoicesScreen";
import type { AccountDto } from "../../../shared/schemas/accounts";
import { colors, radii, space } from "../../theme";

/** True for an account the overdue invoices put on hold (paying them lifts it), not one the bakery paused by hand. */
export const onCreditHold = (a: AccountDto | undefined) => !!a && a.status === "on_hold" && a.creditHold;

/** The sentence the order form shows beside its switched-off button while the account cannot order. */
export function holdReason(a: AccountDto | undefined): string | null {
  if (!a || a.status === "active") return null;
  if (onCreditHold(a)) return "On credit hold: ordering opens again as soon as the overdue invoices are paid.";
  if (a.status === "on_hold") return "Paused by the bakery: call them to order again.";
  return "This account is closed: call the bakery to order again.";
}

/**
 * On credit hold: what is overdue, on how many invoices, and a way to pay it from here — one invoice opens its
 * card payment at once; several are listed under Invoices (overdue first), each paid on its own page.
 */
export function CreditHoldBanner({ account, testID = "credit-hold" }: { account: AccountDto; testID?: string }) {
  const held = onCreditHold(account);
  const overdue = useInvoicesQuery({ overdue: true, sort: "due" }, { enabled: held });
  const list = (overdue.data?.invoices ?? []).filter((i) => i.amountDueCents > 0);
  const checkout = useCheckoutMutation(list[0]?.id ?? 0);
  if (!held) return null;
  const currency = list[0]?.currency ?? "USD";
  const owed = list.reduce((s, i) => s + i.amountDueCents, 0);
  return (
    <View style={styles.box} accessibilityRole="alert" testID={testID}>
      <View style={styles.top}>
        <Feather name="pause-circle" size={22} color={colors.dangerInk} />
        <AppText variant="bodyStrong" color="dangerInk" style={styles.flex}>
          On credit hold
        </AppText>
      </View>
      <AppText testID={`${testID}-text`}>
        {list.length
          ? `${money(owed, currency)} is overdue on ${invoicesLabel(list.length)}. New orders and changes wait until it is paid; ordering opens again as soon as it is.`
          : overdue.isPending
            ? "Overdue invoices put this account on hold. New orders and changes wait until they are paid."
            : "Overdue invoices put this account on hold. Call the bakery if you have paid them."}
      </AppText>
      {list.length === 1 ? (
        <Button label={`Pay ${money(owed, currency)} now`} icon="credit-card" variant="accent" busy={checkout.isPending} onPress={() => checkout.mutate()} testID={`${testID}-pay`} />
      ) : list.length > 1 ? (
        <LinkButton href="/buyer/invoices?show=overdue" label="Pay the overdue invoices" icon="credit-card" variant="accent" testID={`${testID}-pay`} />
      ) : null}
      {list.length > 1 ? (
        <AppText variant="small" color="muted">
          Each invoice is paid by card on its own page.
        </AppText>
      ) : null}
      <FormError message={checkout.isError ? messageOf(checkout.error) : null} testID={`${testID}-error`} />
      {!list.length && !overdue.isPending ? <CallBakery testID={`${testID}-call`} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft, borderWidth: 1, borderColor: colors.danger },
  top: { flexDirection: "row", alignItems: "center", gap: space.sm },
  flex: { flex: 1 },
});
