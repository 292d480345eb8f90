import React from "react";
import { View } from "react-native";
import { Button } from "../../../ui/Button";
import { ChoiceGroup } from "../../../ui/ChoiceGroup";
import { TextField } from "../../../ui/TextField";
import { formatNum } from "../../../format";
import { CM2_PER_IN2, HALF_SHEET_CM2, mmToInchesText, removeOven, setOven, slotNames, type OvenForm, type SettingsFormValues } from "../../../production/settingsForm";
import type { FieldErrors } from "../../../../shared/errors";
import { settingsStyles as styles } from "./styles";

export interface OvenFieldsProps {
  index: number;
  oven: OvenForm;
  values: SettingsFormValues;
  errors: FieldErrors;
  onChange: (changes: Partial<SettingsFormValues>) => void;
}

type MinuteKey = "tempChangeMinutes" | "loadMinutes" | "unloadMinutes";
const MINUTES: { key: MinuteKey; label: string; hint?: string; id: string }[] = [
  { key: "tempChangeMinutes", label: "Minutes to change temperature", hint: "Between loads at different temperatures.", id: "change" },
  { key: "loadMinutes", label: "Minutes to load", id: "load" },
  { key: "unloadMinutes", label: "Minutes to unload", id: "unload" },
];

/** One oven: its name, what one load holds (a shelf area or named pan slots) and its minutes. */
export function OvenFields({ index: i, oven: o, values, errors, onChange }: OvenFieldsProps) {
  const set = <K extends keyof OvenForm>(key: K) => (value: OvenForm[K]) => onChange(setOven(values, i, key, value));
  const err = (k: string) => errors[`ovens.${i}.${k}`];
  const area = Number(o.areaCm2);
  const slots = slotNames(o.slots).length;
  const id = `settings-oven-${i}`;
  return (
    <View style={styles.item} testID={id}>
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField label="Name" value={o.name} onChangeText={set("name")} error={err("name")} testID={`${id}-name`} />
        </View>
        <View style={styles.cell}>
          <ChoiceGroup
            label="One oven load holds"
            value={o.kind}
            onChange={set("kind")}
            choices={[{ value: "area", label: "Shelf area" }, { value: "slots", label: "Named pan slots" }]}
            testID={`${id}-kind`}
          />
        </View>
      </View>
      {o.kind === "area" ? (
        <TextField
          label="Usable shelf area per load (cm²)"
          hint={area > 0 ? `= ${formatNum(Math.round(area / CM2_PER_IN2))} in², about ${Math.floor(area / HALF_SHEET_CM2)} half sheets. The pans' footprints must fit in it.` : "All shelves together; the pans' footprints (length × width) must fit in it."}
          value={o.areaCm2}
          onChangeText={set("areaCm2")}
          error={err("capacity.areaCm2")}
          inputMode="numeric"
          keyboardType="number-pad"
          testID={`${id}-area`}
        />
      ) : (
        <>
          <TextField
            label="Pan slots (names, separated by commas)"
            hint={`${slots === 1 ? "1 slot" : `${slots} slots`}: one pan each, if the pan fits the slot.`}
            value={o.slots}
            onChangeText={set("slots")}
            error={err("capacity.slots") ?? err("capacity.slots.0")}
            placeholder="Shelf 1, Shelf 2, Shelf 3"
            testID={`${id}-slots`}
          />
          <View style={styles.grid}>
            <View style={styles.cell}>
              <TextField label="Slot length (mm)" hint={`= ${mmToInchesText(o.slotLengthMm)}`} value={o.slotLengthMm} onChangeText={set("slotLengthMm")} error={err("capacity.slotLengthMm")} inputMode="numeric" keyboardType="number-pad" testID={`${id}-slot-length`} />
            </View>
            <View style={styles.cell}>
              <TextField label="Slot width (mm)" hint={`= ${mmToInchesText(o.slotWidthMm)}`} value={o.slotWidthMm} onChangeText={set("slotWidthMm")} error={err("capacity.slotWidthMm")} inputMode="numeric" keyboardType="number-pad" testID={`${id}-slot-width`} />
            </View>
          </View>
        </>
      )}
      <View style={styles.grid}>
        {MINUTES.map((m) => (
          <View key={m.key} style={styles.cell}>
            <TextField label={m.label} hint={m.hint} value={o[m.key]} onChangeText={set(m.key)} error={err(m.key)} inputMode="numeric" keyboardType="number-pad" testID={`${id}-${m.id}`} />
          </View>
        ))}
      </View>
      {values.ovens.length > 1 ? <Button label="Remove this oven" variant="ghost" small icon="trash-2" onPress={() => onChange(removeOven(values, i))} testID={`${id}-remove`} /> : null}
    </View>
  );
}
