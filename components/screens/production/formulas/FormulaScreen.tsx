import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { TextLink } from "../../../ui/TextLink";
import { Notice } from "../../../ui/FormError";
import { NotFoundState, isNotFound } from "../../../ui/States";
import { QueryStates } from "../../../ui/QueryStates";
import { AppText } from "../../../ui/Text";
import { useFormulaQuery, useUpdateFormulaMutation } from "../../../api/formulas";
import { useIngredientsQuery } from "../../../api/ingredients";
import { useIsWide } from "../../../shell/useIsWide";
import { ingredientMap, valuesOf } from "../../../production/formulaForm";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { ALLERGEN_LABEL } from "../../../../shared/allergens";
import type { FormulaDto } from "../../../../shared/schemas/production";
import { FormulaEditor } from "./FormulaEditor";
import { FormulaReadOnly } from "./FormulaReadOnly";
import { FormulaHistoryCard } from "./FormulaHistoryCard";
import { FormulaProductsCard } from "./FormulaProductsCard";
import { space } from "../../../theme";

export interface FormulaScreenProps {
  area: KitchenArea;
  id: number;
  /** An earlier version to read (?version=N). */
  version?: number;
  created?: boolean;
}

/** One formula: edit the current version (saved as the next), read an earlier one, see the history. */
export function FormulaScreen({ area, id, version, created }: FormulaScreenProps) {
  const paths = kitchenPaths(area);
  const valid = Number.isInteger(id) && id > 0;
  const current = useFormulaQuery(valid ? id : null);
  const asked = version && version > 0 && current.data && version !== current.data.version ? version : undefined;
  const [saved, setSaved] = useState<string | null>(created ? "Formula added. Give products this formula below so their dough is planned." : null);

  if (!valid || isNotFound(current.error)) {
    return (
      <Screen testID="formula-detail">
        <NotFoundState title="There's no such formula" back={{ href: paths.formulas, label: "All formulas" }} testID="formula-not-found" />
      </Screen>
    );
  }
  return (
    <Screen testID="formula-detail">
      {current.isError ? <TextLink href={paths.formulas} label="‹ All formulas" /> : null}
      <QueryStates query={current} loadingLabel="Loading the formula…" errorTitle="The formula didn't load" testID="formula">
        {(f) => (
          <>
            <TextLink href={paths.formulas} label="‹ All formulas" testID="back-to-formulas" />
            <PageHeader overline={asked ? `Version ${asked} of ${f.version}` : `Formula · version ${f.version}`} title={f.name} testID="formula-title" />
            {saved ? <Notice message={saved} testID="formula-saved" /> : null}
            {f.allergens.length ? <AppText variant="small" color="muted" testID="formula-allergens">{`Allergens: ${f.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}`}</AppText> : null}
            {asked ? <OldVersion id={id} asked={asked} current={f.version} area={area} /> : <CurrentVersion formula={f} onSaved={setSaved} />}
            <Cards formula={f} reading={asked} area={area} />
          </>
        )}
      </QueryStates>
    </Screen>
  );
}

/** The current version in the editor; saving makes the next version. */
function CurrentVersion({ formula: f, onSaved }: { formula: FormulaDto; onSaved: (message: string | null) => void }) {
  const ingredients = useIngredientsQuery();
  const update = useUpdateFormulaMutation(f.id);
  return (
    <QueryStates query={ingredients} loadingLabel="Loading the ingredients…" errorTitle="The ingredients didn't load">
      {(list) => (
        <FormulaEditor
          key={`${f.id}-${f.version}`}
          initial={valuesOf(f)}
          ingredients={list}
          infos={ingredientMap(list)}
          submitLabel={`Save as version ${f.version + 1}`}
          askNote
          onSubmit={async (input) => {
            onSaved(null);
            const s = await update.mutateAsync(input);
            onSaved(`${s.name} is saved as version ${s.version}. Plans not yet set at their cut-off use it now.`);
          }}
        />
      )}
    </QueryStates>
  );
}

/** An earlier version, read-only. */
function OldVersion({ id, asked, current, area }: { id: number; asked: number; current: number; area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const old = useFormulaQuery(id, asked);
  return (
    <QueryStates query={old} loadingLabel={`Loading version ${asked}…`} errorTitle={`Version ${asked} didn't load`} errorTestID="formula-version-error">
      {(f) => (
        <>
          <Notice tone="info" message={`You are reading version ${asked}, read-only. The current version is ${current}.`} testID="formula-old-version" />
          <TextLink href={paths.formula(id)} label="Back to the current version" testID="formula-current-link" />
          <FormulaReadOnly formula={f} />
        </>
      )}
    </QueryStates>
  );
}

/** The products made from it and its history, side by side on a wide screen. */
function Cards({ formula, reading, area }: { formula: FormulaDto; reading?: number; area: KitchenArea }) {
  const wide = useIsWide();
  return (
    <View style={[styles.pair, wide && styles.pairWide]}>
      <View style={wide ? styles.flex : undefined}>
        <FormulaProductsCard formula={formula} />
      </View>
      <View style={wide ? styles.flex : undefined}>
        <FormulaHistoryCard id={formula.id} current={formula.version} reading={reading} paths={kitchenPaths(area)} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  pair: { gap: space.lg },
  pairWide: { flexDirection: "row", alignItems: "flex-start" },
});
