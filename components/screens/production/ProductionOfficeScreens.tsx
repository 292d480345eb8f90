import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { z } from "zod";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { LinkCard } from "../../ui/ListCard";
import { FormError, Notice } from "../../ui/FormError";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useNextBakeDayQuery, useProductionSettingsQuery, useSaveProductionSettingsMutation, type ProductionSettingsDto } from "../../api/production";
import { splitError, validate } from "../../forms/errors";
import { formatDay } from "../../ordering/dates";
import { kitchenPaths } from "../../production/paths";
import { formatMass } from "../../../shared/units";
import type { FieldErrors } from "../../../shared/errors";
import { space } from "../../theme";

/** The same rules as the API's PUT /api/production/settings. */
export const productionSettingsSchema = z.object({
  mixerCapacityKg: z.coerce.number({ invalid_type_error: "Enter the mixer's capacity in kg." }).min(1, "At least 1 kg.").max(500, "At most 500 kg."),
  dispatchTime: z.string().trim().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time such as 06:30."),
  ovens: z.coerce.number({ invalid_type_error: "Enter a whole number." }).int("Whole ovens.").min(1, "At least 1 oven.").max(20, "At most 20 ovens."),
  pansPerLoad: z.coerce.number({ invalid_type_error: "Enter a whole number." }).int("Whole pans.").min(1, "At least 1 pan.").max(100, "At most 100 pans."),
});

const FIELDS = ["mixerCapacityKg", "dispatchTime", "ovens", "pansPerLoad"] as const;

/** The owner's production settings: mixer size, dispatch time and oven room. */
export function ProductionSettingsScreen() {
  const settings = useProductionSettingsQuery();
  return (
    <Screen narrow testID="production-settings">
      <TextLink href="/office/production" label="‹ Production" testID="back-to-production" />
      <PageHeader title="Production settings" subtitle="Every plan is worked out from these: mixes are split to fit the mixer, bakes are scheduled back from dispatch in oven-sized waves." testID="production-settings-title" />
      {settings.isPending ? (
        <LoadingState label="Loading the settings…" />
      ) : settings.isError ? (
        <ErrorState error={settings.error} onRetry={() => settings.refetch()} retrying={settings.isFetching} testID="production-settings-error" />
      ) : (
        <SettingsForm initial={settings.data} />
      )}
    </Screen>
  );
}

function SettingsForm({ initial }: { initial: ProductionSettingsDto }) {
  const save = useSaveProductionSettingsMutation();
  const [values, setValues] = useState({ mixerCapacityKg: String(initial.mixerCapacityKg), dispatchTime: initial.dispatchTime, ovens: String(initial.ovens), pansPerLoad: String(initial.pansPerLoad) });
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const set = (k: keyof typeof values) => (t: string) => {
    setSaved(false);
    setValues((v) => ({ ...v, [k]: t }));
  };
  const submit = () => {
    setSaved(false);
    setFormError(null);
    const checked = validate(productionSettingsSchema, { ...values, mixerCapacityKg: values.mixerCapacityKg.replace(",", ".") });
    if (!checked.ok) return setFields(checked.fields);
    setFields({});
    save.mutate(checked.data, {
      onSuccess: () => setSaved(true),
      onError: (err) => {
        const split = splitError(err, FIELDS);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };
  const kg = Number(values.mixerCapacityKg.replace(",", "."));
  const ovens = Number(values.ovens);
  const pans = Number(values.pansPerLoad);
  return (
    <Card testID="production-settings-form">
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField label="Mixer capacity (kg of dough)" hint={kg > 0 ? `= ${formatMass(kg * 1000, "us")}. Bigger doughs are split into mixes.` : "Bigger doughs are split into mixes."} value={values.mixerCapacityKg} onChangeText={set("mixerCapacityKg")} error={fields.mixerCapacityKg} inputMode="decimal" keyboardType="decimal-pad" testID="settings-mixer" />
        </View>
        <View style={styles.cell}>
          <TextField label="Dispatch time" hint="24-hour, bakery time: when the vans leave." value={values.dispatchTime} onChangeText={set("dispatchTime")} error={fields.dispatchTime} placeholder="06:30" autoCorrect={false} testID="settings-dispatch" />
        </View>
        <View style={styles.cell}>
          <TextField label="Ovens" value={values.ovens} onChangeText={set("ovens")} error={fields.ovens} inputMode="numeric" keyboardType="number-pad" testID="settings-ovens" />
        </View>
        <View style={styles.cell}>
          <TextField label="Pans per oven load" value={values.pansPerLoad} onChangeText={set("pansPerLoad")} error={fields.pansPerLoad} inputMode="numeric" keyboardType="number-pad" testID="settings-pans" />
        </View>
      </View>
      {ovens > 0 && pans > 0 ? <AppText color="muted" testID="settings-wave">{`One bake wave holds ${ovens * pans} pans.`}</AppText> : null}
      <FormError message={formError} testID="production-settings-form-error" />
      {saved ? <Notice message="Production settings saved. Plans not yet frozen use them now; recalculate a frozen day to apply them." testID="production-settings-saved" /> : null}
      <Button label="Save production settings" icon="check" onPress={submit} busy={save.isPending} testID="production-settings-save" block />
    </Card>
  );
}

const HUB_ITEMS: { key: string; label: string; hint: string; icon: React.ComponentProps<typeof Feather>["name"]; href: () => string }[] = [
  { key: "day", label: "Bake day", hint: "Pans, weigh-out cards, the timeline and the production sheet.", icon: "sun", href: () => kitchenPaths("office").day() },
  { key: "formulas", label: "Formulas", hint: "Doughs in baker's percentages, with their history.", icon: "book-open", href: () => kitchenPaths("office").formulas },
  { key: "ingredients", label: "Ingredients", hint: "Kinds, water content, allergens and purchase packs.", icon: "package", href: () => kitchenPaths("office").ingredients },
  { key: "forecast", label: "Purchasing forecast", hint: "What the next 7 days need, in whole packs, with the cost.", icon: "shopping-cart", href: () => kitchenPaths("office").forecast() },
  { key: "settings", label: "Production settings", hint: "Mixer capacity, dispatch time, ovens and pans per load.", icon: "sliders", href: () => "/office/production/settings" },
];

/** The owner's way into production from the office. */
export function ProductionHubScreen() {
  const next = useNextBakeDayQuery();
  return (
    <Screen narrow testID="production-hub">
      <PageHeader title="Production" subtitle={next.data ? `Next bake day: ${formatDay(next.data)}.` : "What the bakery makes, and what it needs."} testID="production-hub-title" />
      <View style={styles.list}>
        {HUB_ITEMS.map((item) => (
          <LinkCard key={item.key} href={item.href()} icon={item.icon} title={item.label} hint={item.hint} testID={`production-${item.key}`} />
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 200 },
  list: { gap: space.sm },
});
