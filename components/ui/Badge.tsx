import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, radii, space, type ColorName } from "../theme";
import { AppText } from "./Text";
import { accountStatusLabel, type AccountStatus } from "../../shared/schemas/accounts";
import { ROLE_LABELS, type Role } from "../../shared/roles";

export type BadgeTone = "sage" | "amber" | "danger" | "crust" | "neutral";

const tones: Record<BadgeTone, { bg: ColorName; fg: ColorName }> = {
  sage: { bg: "sageSoft", fg: "sageInk" },
  amber: { bg: "amberSoft", fg: "amberInk" },
  danger: { bg: "dangerSoft", fg: "dangerInk" },
  crust: { bg: "crustSoft", fg: "crustInk" },
  neutral: { bg: "neutralSoft", fg: "neutralInk" },
};

export function Badge({ label, tone = "neutral", testID }: { label: string; tone?: BadgeTone; testID?: string }) {
  const t = tones[tone];
  return (
    <View style={[styles.badge, { backgroundColor: colors[t.bg] }]} testID={testID}>
      <AppText variant="caption" color={t.fg}>
        {label}
      </AppText>
    </View>
  );
}

const statusTone: Record<AccountStatus, BadgeTone> = { active: "sage", on_hold: "amber", closed: "danger" };

/** An account's status; a hold says whether the bakery paused it or overdue invoices put it on credit hold. */
export function StatusBadge({ status, creditHold, testID }: { status: AccountStatus; creditHold?: boolean; testID?: string }) {
  return <Badge label={accountStatusLabel({ status, creditHold })} tone={statusTone[status]} testID={testID} />;
}

export function RoleBadge({ role }: { role: Role }) {
  return <Badge label={ROLE_LABELS[role]} tone={role === "buyer" ? "neutral" : "crust"} />;
}

const styles = StyleSheet.create({
  badge: { alignSelf: "flex-start", borderRadius: radii.pill, paddingHorizontal: space.sm + 2, paddingVertical: space.xxs },
});
