/** The production entities, one per file; re-exported here for the modules that import them from this path. */
export { Ingredient } from "./ingredient.entity";
export { Formula } from "./formula.entity";
export { FormulaVersion } from "./formula-version.entity";
export { BakeDay } from "./bake-day.entity";
export { ProductionSettings } from "./production-settings.entity";
export { BakehouseMixer } from "./bakehouse-mixer.entity";
export { BakehouseOven } from "./bakehouse-oven.entity";
