import type { AllergenCode } from "../../shared/allergens";
import type { IngredientKind } from "../../shared/production";
import { ingredientInputSchema, type IngredientDto, type IngredientInput } from "../../shared/schemas/production";
import { fieldErrorsFrom } from "../../shared/schemas/common";
import { parseMoney, toDecimal } from "../../shared/money";
import type { FieldErrors } from "../../shared/errors";
import type { CheckResult } from "../forms/checkedSchema";

/** The ingredient form as typed (no React): numbers and money stay text until they are checked. */
export interface IngredientValues {
  name: string;
  kind: IngredientKind | null;
  waterPercent: string;
  allergens: AllergenCode[];
  packName: string;
  packGrams: string;
  /** Dollars as typed, "24.50". */
  packCost: string;
}

export const EMPTY_INGREDIENT: IngredientValues = { name: "", kind: null, waterPercent: "0", allergens: [], packName: "", packGrams: "", packCost: "" };

/** The fields the form shows a message beside, named as the API names them. */
export const INGREDIENT_FIELDS = ["name", "kind", "waterPercent", "allergens", "packName", "packGrams", "packCostCents"] as const;

export function ingredientValues(i: IngredientDto): IngredientValues {
  return { name: i.name, kind: i.kind, waterPercent: String(i.waterPercent), allergens: i.allergens, packName: i.packName, packGrams: String(i.packGrams), packCost: toDecimal(i.packCostCents) };
}

/** The form checked with the shared ingredientInputSchema (the cost is typed in dollars). */
export function checkIngredient(v: IngredientValues): CheckResult<IngredientInput> {
  const cents = v.packCost.trim() === "" ? 0 : parseMoney(v.packCost);
  const checked = ingredientInputSchema.safeParse({
    name: v.name,
    kind: v.kind ?? "",
    waterPercent: v.waterPercent.trim().replace(",", "."),
    allergens: v.allergens,
    packName: v.packName,
    packGrams: v.packGrams.trim() === "" ? "0" : v.packGrams.trim(),
    packCostCents: cents ?? 0,
  });
  const fields: FieldErrors = checked.success ? {} : fieldErrorsFrom(checked.error);
  if (v.waterPercent.trim() === "") fields.waterPercent = "Enter the water content (0 for none).";
  if (cents === null) fields.packCostCents = "Write the cost in dollars and cents, like 24.50.";
  if (!checked.success || Object.keys(fields).length) return { ok: false, fields };
  return { ok: true, input: checked.data };
}
