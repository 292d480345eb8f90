import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import type { Href } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkCard } from "../../ui/ListCard";
import { useSignedInUser } from "../../auth/useAuth";
import { useIsWide } from "../../shell/useIsWide";
import type { Role } from "../../../shared/roles";
import { layout, space } from "../../theme";

const LINKS: { key: string; href: Href; icon: React.ComponentProps<typeof Feather>["name"]; title: string; about: string; roles?: Role[] }[] = [
  { key: "invoices", href: "/office/invoices", icon: "file-text", title: "Invoices", about: "Every invoice and statement; record payments, issue credit notes." },
  { key: "payouts", href: "/office/money/payouts", icon: "dollar-sign", title: "Payouts", about: "Card money sent to the bank, matched to invoices, to reconcile." },
  { key: "aging", href: "/office/money/aging", icon: "clock", title: "Aging", about: "What each account owes, by how long it is past due." },
  { key: "exports", href: "/office/money/exports", icon: "download", title: "Exports", about: "Invoices, payments and payouts as CSV for the accountant." },
  { key: "outbox", href: "/office/outbox", icon: "mail", title: "Outgoing e-mail", about: "Invoice and receipt e-mails: sent, waiting or failed; send a failed one again." },
  { key: "settings", href: "/office/money/settings", icon: "sliders", title: "Billing settings", about: "Sales tax, invoice numbers, credit hold, payment instructions." },
];

/** The office's money desk: one place for everything after the invoice. */
export function BillingHubScreen() {
  const user = useSignedInUser();
  const wide = useIsWide();
  return (
    <Screen testID="money-screen">
      <PageHeader overline="Billing" title="Money" subtitle="Payouts, what is owed, exports and the e-mail that carries invoices." testID="money-title" />
      <View style={[styles.grid, wide && styles.gridWide]}>
        {LINKS.filter((l) => !l.roles || l.roles.includes(user.role)).map((l) => (
          <LinkCard key={l.key} href={l.href} icon={l.icon} title={l.title} hint={l.about} iconBadge testID={`money-${l.key}`} style={wide ? styles.tileWide : undefined} />
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.sm },
  gridWide: { flexDirection: "row", flexWrap: "wrap", gap: space.lg },
  tileWide: { flexBasis: 320, flexGrow: 1, minHeight: layout.minTouch + 24 },
});
