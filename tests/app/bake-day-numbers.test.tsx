import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKER, SETTINGS, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest, type Route } from "./helpers";
import { PRODUCTION_SETTINGS, planView } from "./production-fixtures";
import { setUnitSystem } from "../../components/production/units";
import { planLiquid } from "../../shared/production";
import { formatMass } from "../../shared/units";
import type { PlanView } from "../../components/api/production";

/**
 * The bake day's numbers in the chosen units: the tap water and milk temperatures that feed the ice, the ice and
 * milk chilling on the weigh-out cards, liquid warnings, piece weights, and the cautions worked out from the day.
 */
function numbersPlan(): PlanView {
  const base = planView();
  const [milk, brioche] = base.doughs;
  // Brioche gets a water line: 800 g of tap water at 16 °C for 6 °C liquid → 800 × 10 ÷ 96 = 83.3 g of ice (common practice).
  const briocheMix = { ...brioche.mixes[0], liquidTempC: 6, ingredients: [...brioche.mixes[0].ingredients, { ingredientId: 3, grams: 800, pasteGrams: 0, finalMixGrams: 800 }] };
  return planView({
    inputs: { ...base.inputs, tapC: 16, milkC: 4 },
    products: [
      { ...base.products[0], allergens: ["gluten", "wheat", "egg", "milk"] },
      { ...base.products[1], name: "Sesame brioche buns", allergens: ["gluten", "wheat", "egg", "milk", "sesame"] },
    ],
    doughs: [
      {
        ...milk,
        mixes: [
          // Milk only: chill the milk to 2 °C; never ice it.
          { ...milk.mixes[0], liquidTempC: 2, liquidTempAdvice: null, liquid: planLiquid(2, [{ ingredientId: 2, grams: 1000, water: false }], { tapC: 16, milkC: 4 }) },
          // Colder than milk can be: a warning, in the reader's units.
          { ...milk.mixes[1], liquidTempC: -3, liquidTempAdvice: "(metric text)", liquid: planLiquid(-3, [{ ingredientId: 2, grams: 254, water: false }], { tapC: 16, milkC: 4 }) },
        ],
      },
      {
        ...brioche,
        name: "Brioche",
        ingredients: [...brioche.ingredients, { ingredientId: 3, name: "Water", kind: "liquid", percent: 10, grams: 800, pasteGrams: 0, finalMixGrams: 800 }],
        mixes: [{ ...briocheMix, liquid: planLiquid(6, [{ ingredientId: 3, grams: 800, water: true }], { tapC: 16, milkC: 4 }) }],
      },
    ],
    ingredients: [
      { ingredientId: 1, name: "Bread flour", grams: 5197, kind: "flour" },
      { ingredientId: 2, name: "Whole milk", grams: 2204, kind: "liquid" },
      { ingredientId: 5, name: "Whole egg", grams: 700, kind: "egg" },
    ],
    components: [
      { key: "101:wash:Egg wash", productId: 101, productName: "Milk-bread dinner rolls", kind: "wash", name: "Egg wash", lines: [{ ingredientId: 5, name: "Whole egg", per: "piece", count: 105, gramsEach: 1, grams: 105, note: "" }], totalGrams: 105 },
    ],
    warnings: [],
  });
}

function routes(plan: PlanView, extra: Record<string, Route> = {}): Record<string, Route> {
  return {
    ...sessionRoutes(BAKER),
    "GET /api/settings/calendar": { body: { settings: SETTINGS } },
    "GET /api/production/next-day": { body: { date: "2025-12-03" } },
    "GET /api/production/settings": { body: { settings: PRODUCTION_SETTINGS } },
    "GET /api/production/plan": (req: FakeRequest) => ({ body: { plan: { ...plan, date: req.query.date } } }),
    ...extra,
  };
}

describe("bake day numbers", () => {
  beforeEach(() => {
    signedInAs(BAKER);
    setUnitSystem("metric");
  });

  it("weighs part of the water as ice by the formula, and chills the milk instead of icing it", async () => {
    mockApi(routes(numbersPlan()));
    renderApp("/bake");
    // 800 × (16 − 6) ÷ (16 + 80) = 83.3 g of crushed ice, 717 g of tap water.
    expect(await screen.findByTestId("mix-3-1-ice")).toHaveTextContent("Crushed ice, for the water83 g");
    expect(screen.getByTestId("mix-3-1-final-3")).toHaveTextContent("Water (tap)717 g");
    expect(screen.getByTestId("mix-3-1-advice")).toHaveTextContent(/Weigh the water as 717 g of water from the tap \(16 °C\) \+ 83 g of crushed ice\. Ice replaces water only\.$/);
    // The milk dough: no ice row, the milk chilled.
    expect(screen.queryByTestId("mix-1-1-ice")).toBeNull();
    expect(screen.getByTestId("mix-1-1-final-2")).toHaveTextContent("Whole milk1,000 g");
    expect(screen.getByTestId("mix-1-1-advice")).toHaveTextContent(/Chill the whole milk to 2 °C before weighing \(it comes at 4 °C\).*Do not replace whole milk with ice or water/);
    expect(screen.getByTestId("mix-1-2-advice")).toHaveTextContent(/−?-?3 °C is colder than the liquid can be\. Chill the whole milk as cold as it goes without freezing \(about 1 °C\); never replace it with ice or water, and bring the other temperatures down: let the paste cool further/);
    expect(screen.getByTestId("plan-warnings")).toHaveTextContent(/Milk bread, mix 2: liquid at -3 °C/);
  });

  it("in lb, oz and °F: piece weights, ice, liquid warnings, mixer capacity and the cautions' temperatures", async () => {
    setUnitSystem("us");
    mockApi(routes(numbersPlan()));
    renderApp("/bake");
    // 67 g ÷ 28.349 523 125 g/oz = 2.36 oz, set on the scale at 2.4 oz (NIST Handbook 44: 1 lb = 453.592 37 g).
    expect(await screen.findByTestId("pans-101-units")).toHaveTextContent(/105 pieces of 2\.4 oz dough/);
    // The ice is weighed to the gram (83 g) and shown in ounces: 83 ÷ 28.349 523 125 = 2.93 oz.
    expect(screen.getByTestId("mix-3-1-ice")).toHaveTextContent(`Crushed ice, for the water${formatMass(83, "us")}`);
    expect(formatMass(83, "us")).toBe("2.93 oz");
    expect(screen.getByTestId("mix-1-1-advice")).toHaveTextContent(/Chill the whole milk to 36 °F before weighing \(it comes at 39 °F\)/);
    expect(screen.getByTestId("plan-warnings")).toHaveTextContent(/Milk bread, mix 2: liquid at 27 °F — 27 °F is colder than the liquid can be/);
    expect(await screen.findByTestId("setting-mixer")).toHaveTextContent(/Spiral mixer, 44 lb; 60-qt planetary, 26 lb/);
    const cautions = screen.getByTestId("cautions");
    // One name on the screen and on the production PDF (server/production/plan.pdf.ts heading "Cautions"; issue 10).
    expect(cautions).toHaveTextContent(/^Cautions/);
    expect(cautions).not.toHaveTextContent(/°C/);
    expect(screen.getByTestId("caution-paste-1")).toHaveTextContent(/cooked to 149 °F/);
    expect(screen.getByTestId("caution-paste-ahead")).toHaveTextContent(/from 135 °F to 70 °F within 2 hours and to 41 °F or below within 6 hours/);
    expect(screen.getByTestId("caution-egg-wash")).toHaveTextContent(/Egg wash is made with raw egg: keep it at 41 °F or below/);
  });

  it("names the day's allergens by product and the formula's own cook-to temperature, ending with the deferral", async () => {
    const plan = numbersPlan();
    plan.doughs[0].paste = { ...plan.doughs[0].paste!, cookToC: 70 };
    mockApi(routes(plan));
    renderApp("/bake");
    expect(await screen.findByTestId("caution-allergens")).toHaveTextContent(/Sesame \(Sesame brioche buns\)/);
    expect(screen.getByTestId("caution-allergens")).toHaveTextContent(/Egg \(every product\)/);
    expect(screen.getByTestId("caution-paste-1")).toHaveTextContent(/Hot paste \(Milk bread\).*cooked to 70 °C/);
    expect(screen.getByTestId("mix-1-1-paste-caution")).toHaveTextContent(/cooked to 70 °C/);
    expect(screen.getByTestId("caution-internal")).toHaveTextContent(/record the reading.*Milk bread is done at 89 °C or above/);
    expect(screen.getByTestId("caution-footnote")).toHaveTextContent("Reminders only: follow your local food-safety code, licensed practice and the bakery's own procedures.");
  });

  it("takes the tap water and milk temperatures beside the others and saves them in °C", async () => {
    setUnitSystem("us");
    const api = mockApi(routes(numbersPlan(), { "PUT /api/production/bake-days/:date": (req: FakeRequest) => ({ body: { plan: { ...numbersPlan(), inputs: { ...numbersPlan().inputs, ...(req.body as object) } } } }) }));
    renderApp("/bake");
    // 16 °C = 60.8 °F, shown as 61; 4 °C = 39.2 °F, shown as 39.
    expect(await screen.findByLabelText("Tap water (°F)")).toHaveDisplayValue("61");
    expect(screen.getByLabelText("Milk (°F)")).toHaveDisplayValue("39");
    fireEvent.changeText(screen.getByTestId("temp-tap"), "150"); // 65.6 °C: no tap runs that hot
    fireEvent.press(screen.getByTestId("temps-save"));
    expect(screen.getByTestId("temp-tap-error")).toHaveTextContent("Enter 32 °F to 140 °F.");
    fireEvent.changeText(screen.getByTestId("temp-tap"), "50");
    fireEvent.press(screen.getByTestId("temps-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")).toHaveLength(1));
    // 50 °F = 10 °C; the milk field left as shown keeps its stored 4 °C (39 °F would read back as 3.9 °C).
    expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")[0].body).toMatchObject({ roomC: 22, flourC: 20, pasteC: 30, tapC: 10, milkC: 4 });
  });
});

describe("internal temperatures", () => {
  beforeEach(() => {
    signedInAs(BAKER);
    setUnitSystem("us");
  });

  it("records the temperature reached per oven load, in °C, and says when it is below the dough's target", async () => {
    let progress: PlanView["progress"] = { mixes: [], waves: [] };
    const api = mockApi(routes(numbersPlan(), {
      "GET /api/production/plan": (req: FakeRequest) => ({ body: { plan: { ...numbersPlan(), date: req.query.date, progress } } }),
      "POST /api/production/bake-days/:date/progress": (req: FakeRequest) => {
        const b = req.body as { kind: string; key: string; valueC: number };
        progress = { ...progress, internal: { ...progress.internal, [b.key]: { c: b.valueC, at: "2025-12-03T04:50:00.000-06:00" } } };
        return { body: { progress } };
      },
    }));
    renderApp("/bake");
    expect(await screen.findByTestId("internal-1")).toHaveTextContent(/Oven load 1 · Deck oven.*Milk bread · done at 192 °F or above/);
    fireEvent.changeText(screen.getByTestId("internal-1-input"), "500");
    fireEvent.press(screen.getByTestId("internal-1-save"));
    expect(screen.getByTestId("internal-1-input-error")).toHaveTextContent("Enter 68 °F to 248 °F.");
    // 189 °F = 87.2 °C: below the milk bread's 89 °C (192 °F).
    fireEvent.changeText(screen.getByTestId("internal-1-input"), "189");
    fireEvent.press(screen.getByTestId("internal-1-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")[0].body).toEqual({ kind: "internal", key: "1", valueC: 87.2 });
    expect(await screen.findByTestId("internal-1-recorded")).toHaveTextContent("Reached 189 °F at 4:50 AM: below 192 °F, back in the oven and probe again.");
  });
});
