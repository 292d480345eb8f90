import { screen, within } from "expo-router/testing-library";
import { BAKER, SETTINGS, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest } from "./helpers";
import { PRODUCTION_SETTINGS, planView } from "./production-fixtures";
import { setUnitSystem } from "../../components/production/units";
import { componentLineText } from "../../components/screens/production/ComponentCards";
import { componentCards } from "../../shared/components";
import { unitsFor } from "../../shared/units";

/**
 * The day's component weigh-out cards, from the shared componentCards (the server's plan uses the same function):
 * 32 sesame buns × 2 g of toasted sesame = 64 g; the egg wash's egg and milk, 32 × 1.2 g and 32 × 0.3 g.
 */
const CARDS = componentCards(
  [{ productId: 106, name: "Sesame brioche buns", pieces: 32, pans: 2 }],
  [
    { productId: 106, kind: "wash", name: "Egg wash", ingredientId: 5, grams: 1.2, per: "piece", note: "Whisk egg and milk; brush just before baking." },
    { productId: 106, kind: "wash", name: "Egg wash", ingredientId: 2, grams: 0.3, per: "piece", note: "" },
    { productId: 106, kind: "topping", name: "Toasted sesame topping", ingredientId: 20, grams: 2, per: "piece", note: "" },
  ],
  (id) => ({ 5: "Whole egg", 2: "Whole milk", 20: "Toasted sesame seeds" })[id] ?? "?",
);

beforeEach(() => setUnitSystem("metric"));

describe("component weigh-out cards", () => {
  it("say pieces × grams each = grams to weigh, in the kitchen's units", () => {
    const sesame = CARDS.find((c) => c.name === "Toasted sesame topping")!;
    expect(componentLineText(sesame.lines[0], unitsFor("metric"))).toBe("Toasted sesame seeds · 32 pieces × 2 g = 64 g");
    const wash = CARDS.find((c) => c.name === "Egg wash")!;
    expect(wash.lines.map((l) => l.grams)).toEqual([38.4, 9.6]);
    expect(wash.totalGrams).toBe(48);
    // US units: 64 g = 64 / 28.349523125 oz = 2.26 oz (NIST Handbook 44 Appendix C: 1 oz = 28.349 523 125 g).
    expect(componentLineText(sesame.lines[0], unitsFor("us"))).toMatch(/^Toasted sesame seeds · 32 pieces × 0\.07 oz = 2\.26 oz$/);
  });

  it("show on the bake day under the mixes, one card per component", async () => {
    signedInAs(BAKER);
    const plan = { ...planView(), components: CARDS };
    mockApi({
      ...sessionRoutes(BAKER),
      "GET /api/settings/calendar": { body: { settings: SETTINGS } },
      "GET /api/production/next-day": { body: { date: "2025-12-03" } },
      "GET /api/production/settings": { body: { settings: PRODUCTION_SETTINGS } },
      "GET /api/production/plan": (req: FakeRequest) => ({ body: { plan: { ...plan, date: req.query.date } } }),
    });
    renderApp("/bake");
    const cards = await screen.findByTestId("component-cards");
    expect(screen.getByTestId("component-cards-title")).toHaveTextContent("Toppings, washes and fillings");
    const topping = within(cards).getByTestId("component-card-106-topping-Toasted-sesame-topping");
    expect(topping).toHaveTextContent(/Topping · Sesame brioche buns/);
    expect(topping).toHaveTextContent(/Toasted sesame seeds · 32 pieces × 2 g = 64 g/);
    const wash = within(cards).getByTestId("component-card-106-wash-Egg-wash");
    expect(wash).toHaveTextContent(/Whole egg · 32 pieces × 1\.2 g = 38\.4 g/);
    expect(wash).toHaveTextContent(/Whisk egg and milk/);
    expect(within(wash).getByTestId("component-card-106-wash-Egg-wash-total")).toHaveTextContent("Together 48 g");
  });

  it("are absent when the day's products have no components", async () => {
    signedInAs(BAKER);
    mockApi({
      ...sessionRoutes(BAKER),
      "GET /api/settings/calendar": { body: { settings: SETTINGS } },
      "GET /api/production/next-day": { body: { date: "2025-12-03" } },
      "GET /api/production/settings": { body: { settings: PRODUCTION_SETTINGS } },
      "GET /api/production/plan": (req: FakeRequest) => ({ body: { plan: { ...planView(), date: req.query.date, components: [] } } }),
    });
    renderApp("/bake");
    await screen.findByTestId("mixes-title");
    expect(screen.queryByTestId("component-cards")).toBeNull();
  });
});
