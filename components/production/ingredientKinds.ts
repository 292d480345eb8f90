/** Words for the ingredient kinds (shared/production.ts INGREDIENT_KINDS), on lists, pickers and the formula editor. */
export const KIND_LABEL: Record<string, string> = {
  flour: "Flour",
  liquid: "Liquid",
  fat: "Fat",
  sugar: "Sugar",
  salt: "Salt",
  leavening: "Leavening",
  egg: "Egg",
  inclusion: "Inclusion",
  other: "Other",
};

/** Flour first, then what is usually weighed with it. */
export const KIND_ORDER: string[] = ["flour", "liquid", "egg", "fat", "sugar", "salt", "leavening", "inclusion", "other"];
