import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import type { Href } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { LinkCard } from "../../ui/ListCard";
import { FormError, Notice } from "../../ui/FormError";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText, Heading } from "../../ui/Text";
import { useNextBakeDayQuery, useProductionSettingsQuery, useSaveProductionSettingsMutation, type ProductionSettingsBody, type ProductionSettingsDto } from "../../api/production";
import { useFormulasQuery } from "../../api/formulas";
import { productionSettingsSchema } from "../../../shared/schemas/production";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { TickBox } from "../../ui/TickBox";
import { splitError, validate } from "../../forms/errors";
import { formatDay } from "../../ordering/dates";
import { formatNum } from "../../format";
import { kitchenPaths } from "../../production/paths";
import { formatMass } from "../../../shared/units";
import type { FieldErrors } from "../../../shared/errors";
import { colors, radii, space } from "../../theme";

/** The same rules as the API's PUT /api/production/settings. */
export { productionSettingsSchema };

/** 1 in² = 6.4516 cm² exactly (1 in = 2.54 cm, NIST SP 811). */
const CM2_PER_IN2 = 6.4516;
/** A half sheet pan, 457 × 330 mm (18 × 13 in): to put a shelf area into pans a baker knows. */
const HALF_SHEET_CM2 = (457 * 330) / 100;

interface MixerForm { name: string; capacityKg: string }
interface OvenForm {
  name: string;
  kind: "area" | "slots";
  areaCm2: string;
  slots: string;
  slotLengthMm: string;
  slotWidthMm: string;
  tempChangeMinutes: string;
  loadMinutes: string;
  unloadMinutes: string;
}
interface SettingsFormValues {
  dispatchTime: string;
  shiftStart: string;
  packingMinutes: string;
  people: string;
  divide: string;
  shape: string;
  pan: string;
  mixers: MixerForm[];
  ovens: OvenForm[];
  /** formulaId → hours typed; absent = same-day schedule. */
  retard: Record<number, string>;
}

const dec = (t: string) => t.trim().replace(",", ".");

function formValues(s: ProductionSettingsDto): SettingsFormValues {
  return {
    dispatchTime: s.dispatchTime,
    shiftStart: s.shiftStart ?? "",
    packingMinutes: String(s.packingMinutes),
    people: String(s.crew.people),
    divide: String(s.crew.divideMinutesPerPiece),
    shape: String(s.crew.shapeMinutesPerPiece),
    pan: String(s.crew.panMinutesPerPan),
    mixers: s.mixers.map((m) => ({ name: m.name, capacityKg: String(m.capacityKg) })),
    ovens: s.ovens.map((o) => ({
      name: o.name,
      kind: o.capacity.kind,
      areaCm2: o.capacity.kind === "area" ? String(o.capacity.areaCm2) : "",
      slots: o.capacity.kind === "slots" ? o.capacity.slots.join(", ") : "",
      slotLengthMm: o.capacity.kind === "slots" ? String(o.capacity.slotLengthMm) : "460",
      slotWidthMm: o.capacity.kind === "slots" ? String(o.capacity.slotWidthMm) : "335",
      tempChangeMinutes: String(o.tempChangeMinutes),
      loadMinutes: String(o.loadMinutes),
      unloadMinutes: String(o.unloadMinutes),
    })),
    retard: Object.fromEntries(s.retard.map((r) => [r.formulaId, String(r.hours)])),
  };
}

/** What the form sends: the API's body (numbers still as typed; the schema coerces them). */
export function settingsBody(v: SettingsFormValues): ProductionSettingsBody {
  return {
    dispatchTime: v.dispatchTime.trim(),
    shiftStart: v.shiftStart.trim() ? v.shiftStart.trim() : null,
    packingMinutes: v.packingMinutes.trim(),
    mixers: v.mixers.map((m) => ({ name: m.name, capacityKg: dec(m.capacityKg) })),
    ovens: v.ovens.map((o) => ({
      name: o.name,
      capacity: o.kind === "area"
        ? { kind: "area" as const, areaCm2: o.areaCm2.trim() }
        : { kind: "slots" as const, slots: o.slots.split(",").map((x) => x.trim()).filter(Boolean), slotLengthMm: o.slotLengthMm.trim(), slotWidthMm: o.slotWidthMm.trim() },
      tempChangeMinutes: o.tempChangeMinutes.trim(),
      loadMinutes: o.loadMinutes.trim(),
      unloadMinutes: o.unloadMinutes.trim(),
    })),
    crew: { people: v.people.trim(), divideMinutesPerPiece: dec(v.divide), shapeMinutesPerPiece: dec(v.shape), panMinutesPerPan: dec(v.pan) },
    retard: Object.entries(v.retard).map(([id, hours]) => ({ formulaId: Number(id), hours: dec(hours) })),
  } as unknown as ProductionSettingsBody;
}

const NEW_OVEN: OvenForm = { name: "", kind: "area", areaCm2: "", slots: "", slotLengthMm: "460", slotWidthMm: "335", tempChangeMinutes: "15", loadMinutes: "2", unloadMinutes: "2" };

/** The owner's production settings: mixers, ovens, crew, packing, shift start, dispatch and overnight retard. */
export function ProductionSettingsScreen() {
  const settings = useProductionSettingsQuery();
  return (
    <Screen narrow testID="production-settings">
      <TextLink href="/office/production" label="‹ Production" testID="back-to-production" />
      <PageHeader title="Production settings" subtitle="Every plan is scheduled from these, back from dispatch: each mix on a mixer that holds it, dividing and shaping by the crew, the pans in oven loads that fit each oven." testID="production-settings-title" />
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
  const formulas = useFormulasQuery();
  const [values, setValues] = useState<SettingsFormValues>(() => formValues(initial));
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const change = (f: (v: SettingsFormValues) => SettingsFormValues) => {
    setSaved(false);
    setValues(f);
  };
  const set = (k: "dispatchTime" | "shiftStart" | "packingMinutes" | "people" | "divide" | "shape" | "pan") => (t: string) => change((v) => ({ ...v, [k]: t }));
  const setMixer = (i: number, k: keyof MixerForm) => (t: string) => change((v) => ({ ...v, mixers: v.mixers.map((m, j) => (j === i ? { ...m, [k]: t } : m)) }));
  const setOven = (i: number, k: keyof OvenForm) => (t: string) => change((v) => ({ ...v, ovens: v.ovens.map((o, j) => (j === i ? { ...o, [k]: t } : o)) }));
  const body = settingsBody(values);
  const submit = () => {
    setSaved(false);
    setFormError(null);
    const checked = validate(productionSettingsSchema, body);
    if (!checked.ok) return setFields(checked.fields);
    setFields({});
    save.mutate(checked.data, {
      onSuccess: () => setSaved(true),
      onError: (err) => {
        const split = splitError(err, fieldKeys(values));
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };
  const err = (k: string) => fields[k];
  const crewField = (k: "people" | "divide" | "shape" | "pan", label: string, hint: string, key: string, testID: string) => (
    <View style={styles.cell}>
      <TextField label={label} hint={hint} value={values[k]} onChangeText={set(k)} error={err(key)} inputMode="decimal" keyboardType="decimal-pad" testID={testID} />
    </View>
  );
  return (
    <Card testID="production-settings-form">
      <Heading level={2} variant="heading">Dispatch and the shift</Heading>
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField label="Dispatch time" hint="24-hour, bakery time: when the vans leave." value={values.dispatchTime} onChangeText={set("dispatchTime")} error={err("dispatchTime")} placeholder="06:30" autoCorrect={false} testID="settings-dispatch" />
        </View>
        <View style={styles.cell}>
          <TextField label="Shift starts" optional hint="24-hour; later than dispatch means the evening before. The plan says when a day does not fit it." value={values.shiftStart} onChangeText={set("shiftStart")} error={err("shiftStart")} placeholder="23:30" autoCorrect={false} testID="settings-shift" />
        </View>
        <View style={styles.cell}>
          <TextField label="Packing and loading (minutes)" hint="Every step ends this long before dispatch." value={values.packingMinutes} onChangeText={set("packingMinutes")} error={err("packingMinutes")} inputMode="numeric" keyboardType="number-pad" testID="settings-packing" />
        </View>
      </View>

      <Heading level={2} variant="heading">Crew</Heading>
      <View style={styles.grid}>
        {crewField("people", "People on the shift", "They divide and shape together, one dough at a time.", "crew.people", "settings-crew-people")}
        {crewField("divide", "Dividing (person-minutes per piece)", "To scale and round one piece; 0.15 is about 9 s.", "crew.divideMinutesPerPiece", "settings-crew-divide")}
        {crewField("shape", "Shaping (person-minutes per piece)", "To shape one piece; 0.2 is 12 s.", "crew.shapeMinutesPerPiece", "settings-crew-shape")}
        {crewField("pan", "Panning (person-minutes per pan)", "To fill and set out one pan.", "crew.panMinutesPerPan", "settings-crew-pan")}
      </View>

      <Heading level={2} variant="heading">Mixers</Heading>
      <FormError message={err("mixers") ?? null} testID="settings-mixers-error" />
      {values.mixers.map((m, i) => {
        const kg = Number(dec(m.capacityKg));
        return (
          <View key={i} style={styles.item} testID={`settings-mixer-${i}`}>
            <View style={styles.grid}>
              <View style={styles.cell}>
                <TextField label="Name" value={m.name} onChangeText={setMixer(i, "name")} error={err(`mixers.${i}.name`)} testID={`settings-mixer-${i}-name`} />
              </View>
              <View style={styles.cell}>
                <TextField label="Capacity (kg of dough)" hint={kg > 0 ? `= ${formatMass(kg * 1000, "us")}. One mix at a time; bigger doughs are split into mixes.` : "One mix at a time; bigger doughs are split into mixes."} value={m.capacityKg} onChangeText={setMixer(i, "capacityKg")} error={err(`mixers.${i}.capacityKg`)} inputMode="decimal" keyboardType="decimal-pad" testID={`settings-mixer-${i}-capacity`} />
              </View>
            </View>
            {values.mixers.length > 1 ? <Button label="Remove this mixer" variant="ghost" small icon="trash-2" onPress={() => change((v) => ({ ...v, mixers: v.mixers.filter((_, j) => j !== i) }))} testID={`settings-mixer-${i}-remove`} /> : null}
          </View>
        );
      })}
      {values.mixers.length < 10 ? <Button label="Add a mixer" variant="secondary" small icon="plus" onPress={() => change((v) => ({ ...v, mixers: [...v.mixers, { name: "", capacityKg: "" }] }))} testID="settings-mixer-add" /> : null}

      <Heading level={2} variant="heading">Ovens</Heading>
      <FormError message={err("ovens") ?? null} testID="settings-ovens-error" />
      {values.ovens.map((o, i) => {
        const area = Number(o.areaCm2);
        const slots = o.slots.split(",").map((x) => x.trim()).filter(Boolean).length;
        return (
          <View key={i} style={styles.item} testID={`settings-oven-${i}`}>
            <View style={styles.grid}>
              <View style={styles.cell}>
                <TextField label="Name" value={o.name} onChangeText={setOven(i, "name")} error={err(`ovens.${i}.name`)} testID={`settings-oven-${i}-name`} />
              </View>
              <View style={styles.cell}>
                <ChoiceGroup
                  label="One oven load holds"
                  value={o.kind}
                  onChange={(k) => change((v) => ({ ...v, ovens: v.ovens.map((x, j) => (j === i ? { ...x, kind: k } : x)) }))}
                  choices={[{ value: "area", label: "Shelf area" }, { value: "slots", label: "Named pan slots" }]}
                  testID={`settings-oven-${i}-kind`}
                />
              </View>
            </View>
            {o.kind === "area" ? (
              <TextField
                label="Usable shelf area per load (cm²)"
                hint={area > 0 ? `= ${formatNum(Math.round(area / CM2_PER_IN2))} in², about ${Math.floor(area / HALF_SHEET_CM2)} half sheets. The pans' footprints must fit in it.` : "All shelves together; the pans' footprints (length × width) must fit in it."}
                value={o.areaCm2} onChangeText={setOven(i, "areaCm2")} error={err(`ovens.${i}.capacity.areaCm2`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-area`}
              />
            ) : (
              <>
                <TextField label="Pan slots (names, separated by commas)" hint={`${slots === 1 ? "1 slot" : `${slots} slots`}: one pan each, if the pan fits the slot.`} value={o.slots} onChangeText={setOven(i, "slots")} error={err(`ovens.${i}.capacity.slots`) ?? err(`ovens.${i}.capacity.slots.0`)} placeholder="Shelf 1, Shelf 2, Shelf 3" testID={`settings-oven-${i}-slots`} />
                <View style={styles.grid}>
                  <View style={styles.cell}>
                    <TextField label="Slot length (mm)" hint={`= ${mmToInchesText(o.slotLengthMm)}`} value={o.slotLengthMm} onChangeText={setOven(i, "slotLengthMm")} error={err(`ovens.${i}.capacity.slotLengthMm`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-slot-length`} />
                  </View>
                  <View style={styles.cell}>
                    <TextField label="Slot width (mm)" hint={`= ${mmToInchesText(o.slotWidthMm)}`} value={o.slotWidthMm} onChangeText={setOven(i, "slotWidthMm")} error={err(`ovens.${i}.capacity.slotWidthMm`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-slot-width`} />
                  </View>
                </View>
              </>
            )}
            <View style={styles.grid}>
              <View style={styles.cell}>
                <TextField label="Minutes to change temperature" hint="Between loads at different temperatures." value={o.tempChangeMinutes} onChangeText={setOven(i, "tempChangeMinutes")} error={err(`ovens.${i}.tempChangeMinutes`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-change`} />
              </View>
              <View style={styles.cell}>
                <TextField label="Minutes to load" value={o.loadMinutes} onChangeText={setOven(i, "loadMinutes")} error={err(`ovens.${i}.loadMinutes`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-load`} />
              </View>
              <View style={styles.cell}>
                <TextField label="Minutes to unload" value={o.unloadMinutes} onChangeText={setOven(i, "unloadMinutes")} error={err(`ovens.${i}.unloadMinutes`)} inputMode="numeric" keyboardType="number-pad" testID={`settings-oven-${i}-unload`} />
              </View>
            </View>
            {values.ovens.length > 1 ? <Button label="Remove this oven" variant="ghost" small icon="trash-2" onPress={() => change((v) => ({ ...v, ovens: v.ovens.filter((_, j) => j !== i) }))} testID={`settings-oven-${i}-remove`} /> : null}
          </View>
        );
      })}
      {values.ovens.length < 20 ? <Button label="Add an oven" variant="secondary" small icon="plus" onPress={() => change((v) => ({ ...v, ovens: [...v.ovens, { ...NEW_OVEN }] }))} testID="settings-oven-add" /> : null}

      <Heading level={2} variant="heading">Overnight cold retard</Heading>
      <AppText color="muted">A retarded dough is mixed and shaped the day before; the shaped pans wait in the retarder and are proofed and baked on the day. Common practice: about 2–4 °C for 8–16 h.</AppText>
      {formulas.isError ? <FormError message="The formulas didn't load, so retarding cannot be changed now." testID="settings-retard-error" /> : null}
      {(formulas.data ?? []).map((f) => {
        const on = values.retard[f.id] !== undefined;
        const idx = Object.keys(values.retard).map(Number).indexOf(f.id);
        return (
          <View key={f.id} style={styles.retardRow} testID={`settings-retard-${f.id}`}>
            <TickBox
              label={f.name}
              accessibilityLabel={`Retard ${f.name} overnight`}
              checked={on}
              onChange={(c) => change((v) => {
                const r = { ...v.retard };
                if (c) r[f.id] = "12";
                else delete r[f.id];
                return { ...v, retard: r };
              })}
              testID={`settings-retard-${f.id}-on`}
            />
            {on ? (
              <View style={styles.cell}>
                <TextField label="Hours in the retarder" value={values.retard[f.id]} onChangeText={(t) => change((v) => ({ ...v, retard: { ...v.retard, [f.id]: t } }))} error={err(`retard.${idx}.hours`)} inputMode="decimal" keyboardType="decimal-pad" testID={`settings-retard-${f.id}-hours`} />
              </View>
            ) : null}
          </View>
        );
      })}
      <FormError message={err("retard") ?? null} testID="settings-retard-field-error" />

      <AppText color="muted" testID="settings-summary">{capacitySummary(values)}</AppText>
      <FormError message={formError} testID="production-settings-form-error" />
      {saved ? <Notice message="Production settings saved. Plans not yet set at their cut-off use them now; recalculate a day already set to apply them." testID="production-settings-saved" /> : null}
      <Button label="Save production settings" icon="check" onPress={submit} busy={save.isPending} testID="production-settings-save" block />
    </Card>
  );
}

function mmToInchesText(mm: string): string {
  const n = Number(mm);
  return n > 0 ? `${formatNum(n / 25.4, 0, 1)} in` : "—";
}

/** "2 mixers, 2 ovens (9,100 cm² of shelf; 5 pan slots), 3 people." */
function capacitySummary(v: SettingsFormValues): string {
  const ovens = v.ovens.map((o) => {
    if (o.kind === "area") return `${Number(o.areaCm2) > 0 ? formatNum(Number(o.areaCm2)) : "?"} cm² of shelf`;
    const n = o.slots.split(",").map((x) => x.trim()).filter(Boolean).length;
    return `${n} pan ${n === 1 ? "slot" : "slots"}`;
  });
  const people = Number(v.people);
  return `${v.mixers.length === 1 ? "1 mixer" : `${v.mixers.length} mixers`}, ${v.ovens.length === 1 ? "1 oven" : `${v.ovens.length} ovens`} (${ovens.join("; ")}) per load, ${people === 1 ? "1 person" : `${people > 0 ? people : "?"} people`} on the shift.`;
}

/** Every field key the API may name, for putting its messages beside the right inputs. */
function fieldKeys(v: SettingsFormValues): string[] {
  const keys = ["dispatchTime", "shiftStart", "packingMinutes", "mixers", "ovens", "retard", "crew.people", "crew.divideMinutesPerPiece", "crew.shapeMinutesPerPiece", "crew.panMinutesPerPan"];
  v.mixers.forEach((_, i) => keys.push(`mixers.${i}.name`, `mixers.${i}.capacityKg`));
  v.ovens.forEach((_, i) => keys.push(...["name", "capacity.areaCm2", "capacity.slots", "capacity.slots.0", "capacity.slotLengthMm", "capacity.slotWidthMm", "tempChangeMinutes", "loadMinutes", "unloadMinutes"].map((k) => `ovens.${i}.${k}`)));
  Object.keys(v.retard).forEach((_, i) => keys.push(`retard.${i}.hours`));
  return keys;
}

const HUB_ITEMS: { key: string; label: string; hint: string; icon: React.ComponentProps<typeof Feather>["name"]; href: () => Href }[] = [
  { key: "day", label: "Bake day", hint: "Pans, weigh-out cards, the timeline and the production sheet.", icon: "sun", href: () => kitchenPaths("office").day() },
  { key: "formulas", label: "Formulas", hint: "Doughs in baker's percentages, with their history.", icon: "book-open", href: () => kitchenPaths("office").formulas },
  { key: "ingredients", label: "Ingredients", hint: "Kinds, water content, allergens and purchase packs.", icon: "package", href: () => kitchenPaths("office").ingredients },
  { key: "forecast", label: "Purchasing", hint: "What the next 7 days need, in whole packs, with the cost.", icon: "shopping-cart", href: () => kitchenPaths("office").forecast() },
  { key: "settings", label: "Production settings", hint: "Mixers, ovens, the crew, packing, the shift and overnight retard.", icon: "sliders", href: () => "/office/production/settings" },
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
  item: { gap: space.sm, borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, padding: space.md },
  retardRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 200 },
  list: { gap: space.sm },
});
