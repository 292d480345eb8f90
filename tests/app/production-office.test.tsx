import { Dimensions } from "react-native";
import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKER, BOOKKEEPER, OWNER, SUMMARY, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest, type Route } from "./helpers";
import { FORECAST, INGREDIENTS, PRODUCTION_SETTINGS, formulaDto, ingredient } from "./production-fixtures";
import { setUnitSystem } from "../../components/production/units";
import type { SessionUser } from "../../shared/schemas/auth";

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));
beforeEach(() => setUnitSystem("metric"));

function routes(user: SessionUser, extra: Record<string, Route> = {}): Record<string, Route> {
  return {
    ...sessionRoutes(user),
    "GET /api/office/summary": { body: { summary: SUMMARY } },
    "GET /api/production/next-day": { body: { date: "2025-12-03" } },
    "GET /api/production/forecast": (req: FakeRequest) => ({ body: { forecast: { ...FORECAST, from: req.query.from } } }),
    "GET /api/production/settings": { body: { settings: PRODUCTION_SETTINGS } },
    "GET /api/ingredients": { body: { ingredients: INGREDIENTS } },
    ...extra,
  };
}

describe("purchasing forecast", () => {
  it("downloads the list as CSV for the supplier (issue 12)", async () => {
    signedInAs(BAKER);
    const api = mockApi(routes(BAKER, { "GET /api/production/forecast.csv": { body: "Ingredient,Grams\n" } }));
    renderApp("/bake/forecast");
    fireEvent.press(await screen.findByTestId("forecast-csv"));
    await waitFor(() => expect(api.callsTo("GET", "/api/production/forecast.csv")).toHaveLength(1));
    expect(api.callsTo("GET", "/api/production/forecast.csv")[0].query.from).toBe("2025-12-03");
    // Saving the file is the browser's (components/api/files.ts saveBlob); the journey in Chromium checks the file.
  });

  it("shows packs to buy (rounded up), their cost and the dough per day, from the next bake day", async () => {
    signedInAs(BAKER);
    const api = mockApi(routes(BAKER));
    renderApp("/bake/forecast");
    expect(await screen.findByTestId("forecast-item-1-packs")).toHaveTextContent("Buy 2 × 25 kg sack");
    expect(api.callsTo("GET", "/api/production/forecast")[0].query.from).toBe("2025-12-03");
    expect(screen.getByTestId("forecast-item-1")).toHaveTextContent(/Bread flour.*35\.345 kg.*\$49\.00/); // 1 g resolution in kg: three decimals
    expect(screen.getByTestId("forecast-item-2-packs")).toHaveTextContent("Buy 5 × 1 gal jug");
    expect(screen.getByTestId("forecast-item-10-packs")).toHaveTextContent("Not bought (e.g. tap water)");
    expect(screen.getByTestId("forecast-total")).toHaveTextContent(/\$73\.45/);
    expect(screen.getByTestId("forecast-lines")).toHaveTextContent(/2.*Ingredients to buy/);
    expect(screen.getByTestId("forecast-day-2025-12-03")).toHaveTextContent(/Wed, Dec 3.*10\.169 kg.*11 units/);
    expect(screen.getByTestId("forecast-day-2025-12-07")).toHaveTextContent(/no dough/);
    expect(screen.getByTestId("forecast-range")).toHaveTextContent("Wed, Dec 3 – Tue, Dec 9");
    fireEvent.press(screen.getByTestId("forecast-next"));
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/production/forecast" && c.query.from === "2025-12-10")).toBe(true));
  });

  it("lays the week out as tables from 1024 px, in pounds when asked", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    mockApi(routes(OWNER));
    renderApp("/office/production/forecast?from=2025-12-03");
    expect(await screen.findByTestId("forecast-table")).toBeOnTheScreen();
    expect(screen.getByTestId("forecast-item-1-packs")).toHaveTextContent("2 × 25 kg sack");
    expect(screen.getByTestId("forecast-day-row-1")).toHaveTextContent(/5,602 g.*2,667 g/);
    fireEvent.press(screen.getByTestId("units-us"));
    // 5602 g / 453.592 37 g per lb = 12 lb 5.6 oz.
    expect(screen.getByTestId("forecast-day-row-1")).toHaveTextContent(/12 lb 5\.6 oz/);
  });

  it("shows an error with a retry", async () => {
    signedInAs(BAKER);
    mockApi(routes(BAKER, { "GET /api/production/forecast": apiError(500, "internal", "Something went wrong on the server. Please try again.") }));
    renderApp("/bake/forecast?from=2025-12-03");
    expect(await screen.findByTestId("forecast-error")).toHaveTextContent(/The forecast didn't load/);
    expect(screen.getByTestId("forecast-error-retry")).toBeOnTheScreen();
  });
});

describe("ingredients", () => {
  it("lists the library with kinds, water, allergens and packs", async () => {
    signedInAs(BAKER);
    mockApi(routes(BAKER));
    renderApp("/bake/ingredients");
    expect(await screen.findByTestId("ingredient-row-2")).toHaveTextContent(/Whole milk.*Liquid · water 87 % · Milk.*1 gal jug \(3,900 g\) · \$4\.89/);
    expect(screen.getByTestId("ingredient-row-10")).toHaveTextContent(/Tap · not bought/);
  });

  it("adds an ingredient checked with the shared schema, cost in cents and allergens as codes", async () => {
    signedInAs(BAKER);
    const api = mockApi(routes(BAKER, { "POST /api/ingredients": { status: 201, body: { ingredient: ingredient({ id: 20, name: "Potato flakes" }) } } }));
    const app = renderApp("/bake/ingredients/new");
    fireEvent.press(await screen.findByTestId("ingredient-save"));
    expect(screen.getByTestId("ingredient-name-error")).toHaveTextContent("Name the ingredient.");
    expect(screen.getByTestId("ingredient-kind-error")).toHaveTextContent(/Choose a kind/);
    expect(screen.getByTestId("ingredient-pack-error")).toHaveTextContent("Describe the purchase pack, e.g. 25 kg sack.");
    fireEvent.changeText(screen.getByTestId("ingredient-name"), "Potato flakes");
    fireEvent.press(screen.getByTestId("ingredient-kind-other"));
    fireEvent.changeText(screen.getByTestId("ingredient-water"), "7");
    fireEvent.press(screen.getByTestId("ingredient-allergens-sulphites"));
    fireEvent.changeText(screen.getByTestId("ingredient-pack"), "10 lb bag");
    fireEvent.changeText(screen.getByTestId("ingredient-pack-grams"), "4536");
    expect(screen.getByText("= 10 lb 0 oz")).toBeOnTheScreen();
    fireEvent.changeText(screen.getByTestId("ingredient-pack-cost"), "18.5");
    fireEvent.press(screen.getByTestId("ingredient-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/ingredients")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/ingredients")[0].body).toEqual({ name: "Potato flakes", kind: "other", waterPercent: 7, allergens: ["sulphites"], packName: "10 lb bag", packGrams: 4536, packCostCents: 1850 });
    await waitFor(() => expect(app.getPathname()).toBe("/bake/ingredients"));
  });

  it("edits an ingredient and shows a name clash next to the name", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER, { "PUT /api/ingredients/:id": apiError(409, "name_taken", "Another ingredient has this name.") }));
    renderApp("/office/production/ingredients/2");
    expect(await screen.findByTestId("ingredient-title")).toHaveTextContent("Whole milk");
    expect(screen.getByTestId("ingredient-pack-cost")).toHaveDisplayValue("4.89");
    fireEvent.changeText(screen.getByTestId("ingredient-name"), "Bread flour");
    fireEvent.press(screen.getByTestId("ingredient-save"));
    expect(await screen.findByTestId("ingredient-name-error")).toHaveTextContent("Another ingredient has this name.");
    expect(api.callsTo("PUT", "/api/ingredients/2")[0].body).toMatchObject({ name: "Bread flour", kind: "liquid", waterPercent: 87, allergens: ["milk"], packGrams: 3900, packCostCents: 489 });
  });
});

describe("production in the office", () => {
  it("gives the owner Production in More, and a hub to the bake day, formulas, ingredients, forecast and settings", async () => {
    signedInAs(OWNER);
    mockApi(routes(OWNER));
    renderApp("/office/more");
    fireEvent.press(await screen.findByTestId("more-production"));
    expect(await screen.findByTestId("production-hub-title")).toHaveTextContent("Production");
    for (const key of ["day", "formulas", "ingredients", "forecast", "settings"]) expect(screen.getByTestId(`production-${key}`)).toBeOnTheScreen();
    expect(await screen.findByText("Next bake day: Wed, Dec 3.")).toBeOnTheScreen();
    expect(screen.getByTestId("tab-more")).toBeOnTheScreen();
  });

  it("keeps the bookkeeper out of production", async () => {
    signedInAs(BOOKKEEPER);
    mockApi(routes(BOOKKEEPER));
    const app = renderApp("/office/production/formulas");
    expect(await screen.findByTestId("office-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/office");
    expect(screen.queryByTestId("office-production-card")).toBeNull();
  });

  it("lets the owner set up mixers, ovens by shelf area or named slots, the crew, packing, the shift and overnight retard, checked before sending", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER, {
      "GET /api/formulas": { body: { formulas: [formulaDto(), formulaDto({ id: 3, name: "Brioche", productIds: [102] })] } },
      "PUT /api/production/settings": (req: FakeRequest) => ({ body: { settings: req.body } }),
    }));
    renderApp("/office/production/settings");
    expect(await screen.findByTestId("settings-mixer-0-capacity")).toHaveDisplayValue("20");
    expect(screen.getByTestId("settings-mixer-1-name")).toHaveDisplayValue("60-qt planetary");
    expect(screen.getByTestId("settings-oven-0-area")).toHaveDisplayValue("9100");
    // 9,100 cm² ÷ 6.4516 cm²/in² (1 in = 2.54 cm exactly, NIST SP 811) = 1,410.50 in², shown 1,411; a half sheet is 1,508.1 cm² (6.03 fit).
    expect(screen.getByText(/= 1,411 in², about 6 half sheets/)).toBeOnTheScreen();
    expect(screen.getByTestId("settings-oven-1-slots")).toHaveDisplayValue("Shelf 1, Shelf 2, Shelf 3, Shelf 4, Shelf 5");
    expect(screen.getByTestId("settings-shift")).toHaveDisplayValue("23:30");
    expect(screen.getByTestId("settings-summary")).toHaveTextContent("2 mixers, 2 ovens (9,100 cm² of shelf; 5 pan slots) per load, 3 people on the shift.");

    fireEvent.changeText(screen.getByTestId("settings-dispatch"), "6:30");
    fireEvent.changeText(screen.getByTestId("settings-mixer-0-capacity"), "0");
    fireEvent.changeText(screen.getByTestId("settings-oven-1-slots"), " , ");
    fireEvent.changeText(screen.getByTestId("settings-crew-people"), "0");
    fireEvent.press(screen.getByTestId("production-settings-save"));
    expect(screen.getByTestId("settings-dispatch-error")).toHaveTextContent("Use a 24-hour time such as 06:30.");
    expect(screen.getByTestId("settings-mixer-0-capacity-error")).toHaveTextContent("Mixer capacity (kg) must be at least 1.");
    expect(screen.getByTestId("settings-oven-1-slots-error")).toHaveTextContent("Name at least one pan slot.");
    expect(screen.getByTestId("settings-crew-people-error")).toHaveTextContent("People on the shift: at least 1.");
    expect(api.callsTo("PUT", "/api/production/settings")).toHaveLength(0);

    fireEvent.changeText(screen.getByTestId("settings-dispatch"), "05:45");
    fireEvent.changeText(screen.getByTestId("settings-mixer-0-capacity"), "25,5");
    fireEvent.changeText(screen.getByTestId("settings-oven-1-slots"), "Top, Bottom");
    fireEvent.changeText(screen.getByTestId("settings-crew-people"), "4");
    fireEvent.press(screen.getByTestId("settings-mixer-1-remove"));
    fireEvent.press(screen.getByTestId("settings-oven-add"));
    fireEvent.changeText(screen.getByTestId("settings-oven-2-name"), "Rack oven");
    fireEvent.changeText(screen.getByTestId("settings-oven-2-area"), "16000");
    fireEvent.press(screen.getByTestId("settings-retard-1-on"));
    fireEvent.changeText(screen.getByTestId("settings-retard-1-hours"), "14");
    fireEvent.press(screen.getByTestId("production-settings-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/production/settings")).toHaveLength(1));
    expect(api.callsTo("PUT", "/api/production/settings")[0].body).toEqual({
      dispatchTime: "05:45", shiftStart: "23:30", packingMinutes: 45,
      mixers: [{ name: "Spiral mixer", capacityKg: 25.5 }],
      ovens: [
        { name: "Deck oven", capacity: { kind: "area", areaCm2: 9100 }, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 3 },
        { name: "Convection oven", capacity: { kind: "slots", slots: ["Top", "Bottom"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 10, loadMinutes: 2, unloadMinutes: 2 },
        { name: "Rack oven", capacity: { kind: "area", areaCm2: 16000 }, tempChangeMinutes: 15, loadMinutes: 2, unloadMinutes: 2 },
      ],
      crew: { people: 4, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
      retard: [{ formulaId: 1, hours: 14 }],
    });
    expect(await screen.findByTestId("production-settings-saved")).toBeOnTheScreen();
  });

  it("puts the server's message beside the field it names", async () => {
    signedInAs(OWNER);
    mockApi(routes(OWNER, {
      "GET /api/formulas": { body: { formulas: [formulaDto()] } },
      "PUT /api/production/settings": apiError(400, "validation_error", "Some fields need attention.", { "ovens.0.capacity.areaCm2": "Usable shelf area (cm²): at least 100." }),
    }));
    renderApp("/office/production/settings");
    fireEvent.press(await screen.findByTestId("production-settings-save"));
    expect(await screen.findByTestId("settings-oven-0-area-error")).toHaveTextContent("Usable shelf area (cm²): at least 100.");
  });

  it("puts the baker's ingredients and profile under More", async () => {
    signedInAs(BAKER);
    mockApi(routes(BAKER));
    renderApp("/bake/more");
    expect(await screen.findByTestId("more-ingredients")).toHaveTextContent(/Ingredients.*purchase packs/);
    expect(screen.getByTestId("more-me")).toBeOnTheScreen();
    expect(screen.queryByTestId("more-production")).toBeNull();
    fireEvent.press(screen.getByTestId("more-ingredients"));
    expect(await screen.findByTestId("ingredients-title")).toHaveTextContent("Ingredients");
  });
});
