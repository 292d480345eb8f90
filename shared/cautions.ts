/**
 * The usual cautions shown beside production steps. Panwise states them as reminders; the bakery's own
 * procedures and the local food-safety code and licensed practice are what govern.
 */
export const PRODUCTION_CAUTIONS = [
  { step: "paste", title: "Hot paste", text: "The paste is cooked to about 65 °C and sticks to skin: stir with a long spoon, use a heavy pan, and let it cool before handling or adding it to the mixer." },
  { step: "mix", title: "Mixer guards", text: "Keep the guard in place and hands, hair and spoons out of the bowl while the mixer runs; stop it fully before scraping down." },
  { step: "bake", title: "Hot ovens and pans", text: "Use dry oven gloves long enough to cover the wrists; call out when moving hot pans; keep the floor in front of the oven clear." },
  { step: "divide", title: "Allergen separation", text: "These doughs carry milk, egg and wheat. Keep allergen-free work apart in time or space, clean benches and tools between products, and keep labels with every rack." },
  { step: "cool", title: "Cooling and storage of dairy-rich dough", text: "Dough with milk, butter and egg should not sit warm for long: retard it cold if it waits, cool baked goods before bagging, and keep fillings and washes chilled. Follow the time and temperature limits of your local code." },
] as const;

export const CAUTION_FOOTNOTE = "Reminders only: follow your local food-safety code, licensed practice and the bakery's own procedures.";
