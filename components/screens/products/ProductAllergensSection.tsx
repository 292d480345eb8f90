import React from "react";
import { View } from "react-native";
import { MultiChoice } from "../../ui/MultiChoice";
import { AppText } from "../../ui/Text";
import { mayContainText } from "../../ordering/allergens";
import { AllergenChips } from "../ordering/parts";
import { ALLERGENS, ALLERGEN_LABEL, type AllergenCode } from "../../../shared/allergens";
import type { DeclaredAllergens } from "../../../shared/components";
import { derivedSources } from "./productForm";
import type { ProductFormState } from "./useProductForm";
import { formStyles as styles } from "./formStyles";

/** What it contains (the derived part fixed, the product's own to add), may contain, and what buyers see. */
export function ProductAllergensSection({ form, declared }: { form: ProductFormState; declared: DeclaredAllergens }) {
  const { values, errors } = form;
  const addable = ALLERGENS.filter((a) => !declared.derived.includes(a.code));
  return (
    <>
      <AppText variant="overline" color="muted">
        Allergens
      </AppText>
      {declared.derived.length ? (
        <View style={styles.derived} testID="product-derived-allergens">
          <AppText variant="label">From the formula and components</AppText>
          <AppText variant="small" color="muted">
            Always declared: change the formula or the component to change these.
          </AppText>
          {declared.derived.map((a) => (
            <AppText key={a} testID={`product-derived-${a}`}>{`${ALLERGEN_LABEL[a]} — ${derivedSources(declared, a)}`}</AppText>
          ))}
        </View>
      ) : null}
      <MultiChoice<AllergenCode>
        label={declared.derived.length ? "Also contains" : "Contains"}
        hint={
          values.making === "bought_in"
            ? "The supplier's declaration, from the fixed list (US major food allergens and the EU's 14)."
            : "Anything else it contains, from the fixed list (US major food allergens and the EU's 14)."
        }
        options={addable.map((a) => ({ value: a.code, label: a.label }))}
        optionName={(o) => `${o.label} (contains)`}
        value={values.allergens.filter((a) => !declared.derived.includes(a))}
        onChange={form.set("allergens")}
        error={errors.allergens}
        testID="product-allergens"
      />
      <MultiChoice<AllergenCode>
        label="May contain (traces)"
        options={ALLERGENS.map((a) => ({ value: a.code, label: a.label }))}
        optionName={(o) => `${o.label} (may contain)`}
        value={values.mayContain}
        onChange={form.set("mayContain")}
        error={errors.mayContain}
        testID="product-mayContain"
      />
      {values.mayContainOther.length ? <AppText variant="small" color="muted">{`Also noted: ${values.mayContainOther.join(", ")}`}</AppText> : null}
      {declared.declared.length || values.mayContain.length ? (
        <View style={styles.preview}>
          <AppText variant="caption" color="muted">
            Buyers see
          </AppText>
          <AllergenChips allergens={declared.declared} mayContain={mayContainText(values.mayContain, values.mayContainOther)} testID="product-allergen-preview" />
        </View>
      ) : null}
    </>
  );
}
