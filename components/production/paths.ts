/**
 * Production screens live in two areas: the baker's (/bake/…) and the owner's office (/office/production/…).
 * The screens are the same; their links go to the area they are shown in.
 */
import type { RoutePath } from "../routing";

export type KitchenArea = "baker" | "office";

export interface KitchenPaths {
  area: KitchenArea;
  /** The bake day screen for a date (or the next bake day). */
  day: (date?: string) => RoutePath;
  orders: (date?: string) => RoutePath;
  formulas: RoutePath;
  newFormula: RoutePath;
  formula: (id: number, version?: number) => RoutePath;
  /** A formula just made: its page says it was saved. */
  createdFormula: (id: number) => RoutePath;
  ingredients: RoutePath;
  newIngredient: RoutePath;
  ingredient: (id: number) => RoutePath;
  forecast: (from?: string) => RoutePath;
  /** Owner's production settings (office only). */
  settings: RoutePath | null;
  /** Where "back" from the production screens goes in the office (its production hub). */
  hub: RoutePath | null;
}

/** The path with `?key=date` when there is a date (typed: the query stays on that route). */
const withDate = <P extends RoutePath>(path: P, key: string, date?: string): P | `${P}?${string}` => (date ? `${path}?${key}=${date}` : path);

export function kitchenPaths(area: KitchenArea): KitchenPaths {
  if (area === "office") {
    const base = "/office/production" as const;
    return {
      area,
      day: (date) => withDate(`${base}/day`, "date", date),
      orders: (date) => withDate("/office/orders", "date", date),
      formulas: `${base}/formulas`,
      newFormula: `${base}/formulas/new`,
      formula: (id, version) => (version ? `${base}/formulas/${id}?version=${version}` : `${base}/formulas/${id}`),
      createdFormula: (id) => `${base}/formulas/${id}?created=1`,
      ingredients: `${base}/ingredients`,
      newIngredient: `${base}/ingredients/new`,
      ingredient: (id) => `${base}/ingredients/${id}`,
      forecast: (from) => withDate(`${base}/forecast`, "from", from),
      settings: `${base}/settings`,
      hub: base,
    };
  }
  return {
    area,
    day: (date) => withDate("/bake/day", "date", date),
    orders: (date) => withDate("/bake/orders", "date", date),
    formulas: "/bake/formulas",
    newFormula: "/bake/formulas/new",
    formula: (id, version) => (version ? `/bake/formulas/${id}?version=${version}` : `/bake/formulas/${id}`),
    createdFormula: (id) => `/bake/formulas/${id}?created=1`,
    ingredients: "/bake/ingredients",
    newIngredient: "/bake/ingredients/new",
    ingredient: (id) => `/bake/ingredients/${id}`,
    forecast: (from) => withDate("/bake/forecast", "from", from),
    settings: null,
    hub: null,
  };
}
