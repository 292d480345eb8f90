/**
 * Production arithmetic: pans, doughs in baker's percentages, the cooked paste, mixes sized for the mixer,
 * liquid temperatures from the desired dough temperature. The day's schedule is shared/schedule/.
 * Pure functions: the server and the screens use the same ones.
 */
export * from "./types";
export * from "./figures";
export { round, roundGrams, apportion } from "./rounding";
export * from "./dough";
export * from "./liquid";
