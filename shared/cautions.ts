/**
 * The cautions beside production steps and the day's safety reminders, worked out from what the day actually
 * bakes: the allergens of the day's products (by name), each formula's own paste cook-to temperature, steam,
 * lifting, flour dust, cooling and holding a cooked milk paste made ahead, raw egg wash, and the internal
 * temperature to record. Every temperature and weight is written in the unit system the baker chose.
 * Panwise states them as reminders; the list always ends with the deferral to the local food-safety code,
 * licensed practice and the bakery's own procedures, which are what govern.
 */
import { ALLERGEN_LABEL, sortAllergens, type AllergenCode } from "./allergens";
import { COLDEST_MILK_C, WARMEST_LIQUID_C, type LiquidPlan, type StepKind } from "./production";
import { formatCount, unitsFor, type Units, type UnitSystem } from "./units";

export interface Caution {
  /** Stable key ("allergens", "paste-3", "lifting"…), for tests and lists. */
  key: string;
  /** The step it goes beside. */
  step: StepKind;
  title: string;
  text: string;
}

/**
 * The step cautions in general terms (no figures: those come from the day, see dayCautions). Used for the
 * small tags beside timeline steps.
 */
export const PRODUCTION_CAUTIONS = [
  { step: "paste", title: "Hot paste", text: "The paste is cooked hot and sticks to skin: stir with a long spoon, use a heavy pan, and let it cool before handling or adding it to the mixer." },
  { step: "mix", title: "Mixer guards", text: "Keep the guard in place and hands, hair and spoons out of the bowl while the mixer runs; stop it fully before scraping down." },
  { step: "bake", title: "Hot ovens and pans", text: "Use dry oven gloves long enough to cover the wrists; open the door and stand aside while the steam clears; call out when moving hot pans; keep the floor in front of the oven clear." },
  { step: "divide", title: "Allergen separation", text: "Keep allergen-free work apart in time or space, clean benches and tools between products, and keep labels with every rack." },
  { step: "wash", title: "Raw egg wash", text: "Keep egg wash chilled between uses, make it fresh for the shift and throw the rest away at the end; wash your hands after brushing." },
  { step: "cool", title: "Cooling and storage", text: "Cool baked goods on racks before slicing or bagging, keep fillings and washes chilled, and retard dough cold if it has to wait." },
] as const satisfies readonly { step: StepKind; title: string; text: string }[];

export const CAUTION_FOOTNOTE = "Reminders only: follow your local food-safety code, licensed practice and the bakery's own procedures.";

/**
 * FDA Food Code (2022) 3-501.14(A): cooked time/temperature-control food is cooled from 57 °C (135 °F) to 21 °C
 * (70 °F) within 2 hours, and to 5 °C (41 °F) or less within 6 hours in all. 3-501.16(A)(2): cold holding at
 * 5 °C (41 °F) or less.
 */
export const FOOD_CODE_COOLING = { fromC: 57, midC: 21, midHours: 2, coldC: 5, totalHours: 6 } as const;

/**
 * Lifting: the NIOSH Revised Lifting Equation's load constant is 23 kg (51 lb), the most recommended for one
 * person under ideal conditions (NIOSH 1994, from memory). Doughs are lifted out of the bowl: common practice
 * splits a dough over about 10 kg, or lifts it with two people. Flour sacks are commonly 25 kg (or 50 lb).
 */
export const LIFT_DOUGH_KG = 10;
export const NIOSH_LOAD_CONSTANT_KG = 23;
export const FLOUR_SACK_KG = 25;

/** What the caution derivation reads from a plan (the plan DTO fits; older frozen plans may lack allergens). */
export interface CautionDay {
  products: { name: string; formulaId: number | null; allergens?: readonly string[] | null }[];
  /** The day's component cards (toppings, washes…) and the ingredients' kinds, to tell a raw egg wash. */
  components?: readonly { kind: string; name: string; productName: string; lines: readonly { ingredientId: number }[] }[] | null;
  ingredients?: readonly { ingredientId: number; kind?: string | null }[];
  doughs: {
    formulaId: number;
    name: string;
    targetInternalC: number | null;
    paste: { cookToC: number } | null;
    mixes: { index: number; doughGrams: number }[];
    ingredients: { kind: string; grams: number }[];
  }[];
  timeline: { step: string; formulaId?: number | null }[];
}

const stepText = (step: StepKind) => PRODUCTION_CAUTIONS.find((c) => c.step === step)!.text;
const list = (xs: string[]) => (xs.length <= 1 ? xs.join("") : `${xs.slice(0, -1).join(", ")} and ${xs[xs.length - 1]}`);
const asUnits = (u: Units | UnitSystem): Units => (typeof u === "string" ? unitsFor(u) : u);

/** Every caution for the day, in order of the work, ending with the deferral to local code and licensed practice. */
export function dayCautions(day: CautionDay, units: Units | UnitSystem): Caution[] {
  const u = asUnits(units);
  const out: Caution[] = [];
  const t = (c: number) => u.temp(c);
  const hasDough = day.doughs.length > 0;

  // Allergens, named from the day's products.
  const byAllergen = new Map<AllergenCode, string[]>();
  let unknown = 0;
  for (const p of day.products) {
    if (!p.allergens) { unknown++; continue; }
    for (const a of sortAllergens(p.allergens)) byAllergen.set(a, [...(byAllergen.get(a) ?? []), p.name]);
  }
  if (byAllergen.size || unknown) {
    const all = day.products.length;
    const parts = sortAllergens(byAllergen.keys()).map((a) => {
      const names = byAllergen.get(a)!;
      return `${ALLERGEN_LABEL[a]} (${names.length === all && all > 1 ? "every product" : list(names)})`;
    });
    const head = parts.length ? `Today's products carry ${list(parts)}.` : "";
    const missing = unknown ? ` ${formatCount(unknown, "product has", "products have")} no allergen list on this plan: check their labels.` : "";
    out.push({ key: "allergens", step: "divide", title: "Allergens today", text: `${head}${missing} Keep allergen-free work apart in time or space, clean benches, tools and trays between products, keep toppings in closed, labeled containers, and keep a label with every rack.`.trim() });
  }

  // The paste: each formula's own cook-to temperature; steam from the pot; cooling and holding when made ahead.
  const pastes = day.doughs.filter((d) => d.paste);
  for (const d of pastes) {
    out.push({ key: `paste-${d.formulaId}`, step: "paste", title: `Hot paste (${d.name})`, text: pasteCautionText(d.paste!.cookToC, u) });
  }
  if (pastes.length) {
    const c = FOOD_CODE_COOLING;
    out.push({
      key: "paste-ahead",
      step: "paste",
      title: "A paste made ahead",
      text: `Cooked milk paste is a food to keep out of the warm range: if it is made ahead, cool it in a shallow covered container from ${t(c.fromC)} to ${t(c.midC)} within ${c.midHours} hours and to ${t(c.coldC)} or below within ${c.totalHours} hours in all, then keep it at ${t(c.coldC)} or below. Otherwise cook it fresh for each mix.`,
    });
  }

  if (hasDough) {
    out.push({ key: "mixer", step: "mix", title: "Mixer guards", text: stepText("mix") });
    out.push({
      key: "flour-dust",
      step: "mix",
      title: "Flour dust",
      text: "Flour dust can cause asthma: tip flour low and slowly, start the mixer on its slowest speed with the guard down, sweep with a vacuum or damp cloth rather than a brush or air line, and wear a dust mask when tipping sacks.",
    });
  }

  // Lifting: the day's heaviest mix and the sacks.
  const heavy = day.doughs.flatMap((d) => d.mixes.filter((m) => m.doughGrams > LIFT_DOUGH_KG * 1000).map((m) => ({ d, m })));
  const flourGrams = day.doughs.reduce((s, d) => s + d.ingredients.filter((i) => i.kind === "flour").reduce((a, i) => a + i.grams, 0), 0);
  if (heavy.length || flourGrams > 0) {
    const top = heavy.sort((a, b) => b.m.doughGrams - a.m.doughGrams)[0];
    const doughText = top
      ? `The heaviest dough today is ${top.d.name}, mix ${top.m.index}, at ${u.mass(top.m.doughGrams)}: lift it out of the bowl in pieces, or with two people. `
      : "";
    out.push({
      key: "lifting",
      step: "mix",
      title: "Lifting",
      text: `${doughText}Flour sacks weigh up to ${u.capacity(FLOUR_SACK_KG)}, more than the ${u.capacity(NIOSH_LOAD_CONSTANT_KG)} one person should lift even at best: use a sack trolley or two people, lift from waist height, and never twist with a load.`,
    });
  }

  // Raw egg wash: a wash component made with egg, or a formula's wash step.
  const kinds = new Map((day.ingredients ?? []).map((i) => [i.ingredientId, i.kind ?? null]));
  const eggWashes = (day.components ?? []).filter((c) => c.kind === "wash" && c.lines.some((l) => kinds.get(l.ingredientId) === "egg")).map((c) => c.name);
  const washSteps = day.timeline.some((e) => e.step === "wash");
  if (eggWashes.length || washSteps) {
    const c = FOOD_CODE_COOLING;
    const names = [...new Set(eggWashes)];
    const which = names.length ? `${list(names)} ${names.length === 1 ? "is" : "are"} made with raw egg: ` : "If the wash is made with raw egg: ";
    out.push({
      key: "egg-wash",
      step: "wash",
      title: "Raw egg wash",
      text: `${which}keep it at ${t(c.coldC)} or below between uses, make it fresh for the shift, never top up old wash with new, and throw what is left away at the end of the shift. Wash your hands and the brushes after brushing; the washed pieces are baked straight after.`,
    });
  }

  if (day.timeline.some((e) => e.step === "bake") || hasDough) {
    out.push({ key: "ovens", step: "bake", title: "Hot ovens and steam", text: stepText("bake") });
  }

  // The internal temperature to reach, and to write down.
  const targets = day.doughs.filter((d) => d.targetInternalC !== null);
  if (targets.length) {
    out.push({
      key: "internal",
      step: "bake",
      title: "Internal temperature: record it",
      text: `Probe the center of one piece from every oven load and record the reading, the time and your initials: ${list(targets.map((d) => `${d.name} is done at ${t(d.targetInternalC!)} or above`))}. A load below it goes back in.`,
    });
  }

  if (hasDough) out.push({ key: "cooling", step: "cool", title: "Cooling and storage", text: stepText("cool") });
  out.push({ key: "deferral", step: "cool", title: "Your code governs", text: CAUTION_FOOTNOTE });
  return out;
}

/** The hot-paste caution with the formula's own cook-to temperature. */
export function pasteCautionText(cookToC: number, units: Units | UnitSystem): string {
  const u = asUnits(units);
  return `The paste is cooked to ${u.temp(cookToC)} and sticks to skin: use a heavy pan and a long spoon, stir without stopping, lift the lid away from you so the steam goes the other way, and let the paste cool before handling it or adding it to the mixer.`;
}

/**
 * What to do with the liquid, in words and units: ice only ever replaces part of a water line; milk is chilled
 * (never turned into ice or water); and nothing here ever asks for a hotter paste or liquid above 40 °C, which the
 * hot-paste and yeast cautions rule out. Null when the liquid is right as it comes.
 */
export function liquidAdviceText(l: LiquidPlan, units: Units | UnitSystem, nameOf: (ingredientId: number) => string, withPaste: boolean): string | null {
  const u = asUnits(units);
  const water = l.waterIngredientId !== null ? nameOf(l.waterIngredientId).toLowerCase() : "water";
  const others = list(l.otherIngredientIds.map((id) => nameOf(id).toLowerCase())) || "milk";
  const fromCooler = l.otherLiquidGrams > 0 ? ` and the ${others} straight from the cooler (${u.temp(l.milkC)})` : "";
  const iceSplit = `${u.mass(Math.max(0, l.waterGrams - l.iceGrams))} of ${water} from the tap (${u.temp(l.tapC)}) + ${u.mass(l.iceGrams)} of crushed ice`;
  const otherFactors = withPaste
    ? "let the paste cool further before it goes in, chill the flour, or mix in a cooler spot"
    : "chill the flour, or mix in a cooler spot";
  switch (l.action) {
    case "as_is":
      return null;
    case "ice":
      return `Weigh the ${water} as ${iceSplit}${fromCooler}. Ice replaces water only.`;
    case "chill":
      return `Chill the ${others} to ${u.temp(l.chillToC!)} before weighing (it comes at ${u.temp(l.milkC)}), in an ice bath or the coldest part of the cooler. Do not replace ${others} with ice or water: that makes a different dough.`;
    case "ice_and_chill":
      return `Weigh all ${u.mass(l.waterGrams)} of the ${water} as crushed ice, and chill the ${others} to ${u.temp(l.chillToC!)} (it comes at ${u.temp(l.milkC)}). Ice replaces water only.`;
    case "warm":
      return `Warm the liquid to ${u.temp(l.warmToC!)}${l.otherLiquidGrams > 0 ? `, the ${others} gently` : ""}; never above ${u.temp(WARMEST_LIQUID_C)}.`;
    case "too_cold": {
      const best =
        l.waterGrams > 0 && l.chillToC === null
          ? `Weigh the ${water} as ${iceSplit}${fromCooler}`
          : l.waterGrams > 0
            ? `Weigh all ${u.mass(l.waterGrams)} of the ${water} as crushed ice and chill the ${others} to ${u.temp(Math.max(l.chillToC!, COLDEST_MILK_C))}`
            : l.otherLiquidGrams > 0
              ? `Chill the ${others} as cold as it goes without freezing (about ${u.temp(COLDEST_MILK_C)}); never replace it with ice or water`
              : "Use the coldest liquid you have";
      return `${u.temp(l.wantedC)} is colder than the liquid can be. ${best}, and bring the other temperatures down: ${otherFactors}. The dough may still come out a little warm: keep the bulk ferment short and watch it.`;
    }
    case "too_warm":
      return `${u.temp(l.wantedC)} is warmer than liquid should be for the yeast. Warm the liquid to no more than ${u.temp(WARMEST_LIQUID_C)}, let the flour come up to room temperature, and expect the dough to start below its target: give it a few minutes' longer mix, or a longer bulk ferment and proof.${withPaste ? " Add the paste cooled, as always, not hotter." : ""}`;
  }
}

interface LiquidDough {
  name: string;
  paste: unknown | null;
  ingredients: { ingredientId: number; name: string }[];
  mixes: { index: number; liquidTempC: number | null; liquid?: LiquidPlan | null }[];
}

/** The liquid advice of one mix of a plan's dough, in the reader's units (null when the liquid is right as it comes). */
export function mixLiquidAdvice(dough: LiquidDough, mix: LiquidDough["mixes"][number], units: Units | UnitSystem): string | null {
  if (!mix.liquid) return null;
  const names = new Map(dough.ingredients.map((i) => [i.ingredientId, i.name]));
  return liquidAdviceText(mix.liquid, units, (id) => names.get(id) ?? "liquid", !!dough.paste);
}

/**
 * Liquids that cannot be reached, as plan warnings in the reader's units: "Milk bread, mix 2: liquid at 35 °F — …".
 * Plans frozen before the liquid plan existed carry these in their own warnings already (in °C) and add none here.
 */
export function liquidWarnings(plan: { doughs: LiquidDough[] }, units: Units | UnitSystem): string[] {
  const u = asUnits(units);
  const out: string[] = [];
  for (const d of plan.doughs) {
    for (const m of d.mixes) {
      if (!m.liquid || (m.liquid.action !== "too_cold" && m.liquid.action !== "too_warm")) continue;
      out.push(`${d.name}, mix ${m.index}: liquid at ${u.temp(m.liquid.wantedC)} — ${mixLiquidAdvice(d, m, u)}`);
    }
  }
  return out;
}
