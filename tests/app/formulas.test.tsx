import { fireEvent, screen, waitFor, within } from "expo-router/testing-library";
import { BAKER, OWNER, PRODUCTS, apiError, mockApi, product, renderApp, sessionRoutes, signedInAs, type FakeRequest, type Route } from "./helpers";
import { HISTORY, INGREDIENTS, formulaDto } from "./production-fixtures";
import { emptyFormula, ingredientMap, liveFigures, liveProblems, valuesOf } from "../../components/production/formulaForm";
import type { FormulaDto } from "../../shared/schemas/production";
import type { FormulaVersionDto } from "../../components/api/formulas";

const V1 = formulaDto({ version: 1, lines: formulaDto().lines.map((l) => (l.ingredientId === 2 ? { ...l, percent: 55 } : l)) });

function routes(user = BAKER, extra: Record<string, Route> = {}): Record<string, Route> {
  return {
    ...sessionRoutes(user),
    "GET /api/ingredients": { body: { ingredients: INGREDIENTS } },
    "GET /api/products": { body: { products: PRODUCTS.map((p) => (p.id === 101 ? { ...p, formulaId: 1 } : p)) } },
    "GET /api/formulas": { body: { formulas: [formulaDto(), formulaDto({ id: 3, name: "Brioche", version: 1, paste: null, productIds: [102], figures: { ...formulaDto().figures, hydrationPercent: 12, effectiveHydrationPercent: 63.2, pasteSharePercent: 0, pastePercent: 0 } })] } },
    "GET /api/formulas/:id": (req: FakeRequest) => ({ body: { formula: req.query.version === "1" ? V1 : formulaDto() } }),
    "GET /api/formulas/:id/history": { body: { versions: HISTORY } },
    ...extra,
  };
}

describe("formula figures and checks (shared formulaFigures / validateFormula)", () => {
  const infos = ingredientMap(INGREDIENTS);

  it("works out the milk bread's figures", () => {
    const f = liveFigures(valuesOf(formulaDto()), infos);
    // 100 + 58 + 10 + 10 + 10 + 1.8 + 1.3; 5 % of flour × (1 + 5).
    // Effective hydration by the usual convention: water in milk (87 % here), egg (76 %) and butter (16 % in this fixture)
    // over the flour, 50.46 + 7.6 + 1.6 = 59.66 %; the flour's own 12 % moisture (and the dry yeast's) is not counted.
    expect(f.totalPercent).toBeCloseTo(191.1, 6);
    expect(f.hydrationPercent).toBe(58);
    expect(f.effectiveHydrationPercent).toBeCloseTo(59.66, 6);
    expect(f.flourMoisturePercent).toBeCloseTo(12, 6);
    expect(f.pastePercent).toBeCloseTo(30, 6);
    expect(f.doughYieldPerKgFlour).toBeCloseTo(1911, 6);
  });

  it("keeps the checks for lines still being filled in until a save is tried", () => {
    const v = emptyFormula();
    expect(liveProblems(v, infos, false)).toEqual({});
    expect(liveProblems(v, infos, true)).toEqual({ "lines.0.ingredientId": "Choose an ingredient." });
  });
});

describe("formulas", () => {
  beforeEach(() => signedInAs(BAKER));

  it("lists formulas with version, hydration, paste share and the products made from them", async () => {
    mockApi(routes());
    renderApp("/bake/formulas");
    const row = await screen.findByTestId("formula-row-1");
    expect(row).toHaveTextContent(/Milk bread/);
    expect(row).toHaveTextContent(/v2/);
    expect(row).toHaveTextContent(/Hydration 58 % \(effective 59\.7 %\) · paste 5 % of flour/);
    expect(row).toHaveTextContent(/For: Milk-bread dinner rolls/);
    expect(screen.getByTestId("formula-row-3")).toHaveTextContent(/no paste.*For: Brioche burger buns/);
    expect(screen.getByTestId("tab-formulas")).toBeOnTheScreen();
  });

  it("shows the figures live and flags flour that isn't 100 % before saving", async () => {
    const api = mockApi(routes());
    renderApp("/bake/formulas/1");
    expect(await screen.findByTestId("figure-total")).toHaveTextContent("191.1 %");
    expect(screen.getByTestId("figure-flour")).toHaveTextContent("100 %");
    expect(screen.getByTestId("figure-hydration")).toHaveTextContent("58 %");
    expect(screen.getByTestId("figure-effective")).toHaveTextContent("59.7 %");
    expect(screen.getByTestId("figure-flour-moisture-box")).toHaveTextContent(/12 %.*Flour's own moisture.*not in the hydration/);
    expect(screen.getByTestId("figure-paste-share")).toHaveTextContent("5 %");
    expect(screen.getByTestId("figure-paste")).toHaveTextContent("30 %");
    expect(screen.getByTestId("figure-yield")).toHaveTextContent("1,911 g");

    fireEvent.changeText(screen.getByTestId("line-1-percent"), "62");
    expect(screen.getByTestId("figure-total")).toHaveTextContent("195.1 %");
    expect(screen.getByTestId("figure-hydration")).toHaveTextContent("62 %");
    expect(screen.getByTestId("figure-effective")).toHaveTextContent("63.1 %"); // 62 × 0.87 + 7.6 + 1.6

    fireEvent.changeText(screen.getByTestId("line-0-percent"), "90");
    expect(screen.getByTestId("formula-lines-error")).toHaveTextContent("The flour lines add up to 90 %; in baker's percentages they must add up to 100 %.");
    expect(screen.getByTestId("figure-flour")).toHaveTextContent("90 %");
    fireEvent.press(screen.getByTestId("formula-save"));
    expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(0);

    fireEvent.changeText(screen.getByTestId("line-0-percent"), "100");
    expect(screen.queryByTestId("formula-lines-error")).toBeNull();
  });

  it("checks the paste against the lines it is cooked from", async () => {
    mockApi(routes());
    renderApp("/bake/formulas/1");
    fireEvent.changeText(await screen.findByTestId("paste-share"), "40");
    expect(screen.getByTestId("paste-ratio-error")).toHaveTextContent("The paste needs 200 % liquid but the formula has only 58 % of that liquid.");
    fireEvent.changeText(screen.getByTestId("paste-share"), "120");
    expect(screen.getByTestId("paste-share-error")).toHaveTextContent("Cook between 0 and 100 % of the flour.");
  });

  it("warns of a friction factor implausible in °C (a habitual °F 26) without refusing it, and says what the factor is", async () => {
    const api = mockApi(routes(BAKER, { "PUT /api/formulas/:id": { body: { formula: { ...formulaDto(), version: 3, frictionC: 26 } } } }));
    renderApp("/bake/formulas/1");
    const friction = await screen.findByTestId("formula-friction");
    expect(screen.getByText(/the factor that makes the measured dough temperature come out/)).toBeOnTheScreen();
    expect(screen.queryByTestId("formula-friction-warning")).toBeNull();
    fireEvent.changeText(friction, "26");
    // 26 °F as a temperature difference is 26 × 5/9 = 14.4 °C; typed as °C the liquid comes out 11.6 °C colder.
    expect(screen.getByTestId("formula-friction-warning")).toHaveTextContent(/26 is high for a friction factor in °C \(usually about 1–16 °C in a mixer\)\. If it is a °F factor, in °C it is 14\.4; as it stands the liquid comes out about 11\.6 °C colder\.$/);
    fireEvent.press(screen.getByTestId("formula-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(1));
    expect(api.callsTo("PUT", "/api/formulas/1")[0].body).toMatchObject({ frictionC: 26 });
  });

  it("refuses a paste cooked below about 60 °C (wheat starch gelatinisation; common practice 60–70 °C)", async () => {
    const api = mockApi(routes());
    renderApp("/bake/formulas/1");
    fireEvent.changeText(await screen.findByTestId("paste-cook"), "40");
    expect(screen.getByTestId("paste-cook-error")).toHaveTextContent("Cook the paste to 60–100 °C: below about 60 °C the wheat starch does not gelatinize and the paste does not set (about 65 °C is usual).");
    fireEvent.press(screen.getByTestId("formula-save"));
    expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(0);
    fireEvent.changeText(screen.getByTestId("paste-cook"), "65");
    expect(screen.queryByTestId("paste-cook-error")).toBeNull();
  });

  it("names the fields in their errors as the labels do: target internal temperature, desired dough temperature", async () => {
    const api = mockApi(routes());
    renderApp("/bake/formulas/1");
    const internal = await screen.findByTestId("formula-internal");
    expect(screen.getByLabelText("Target internal temperature (°C)")).toBeOnTheScreen();
    expect(screen.getByLabelText("Desired dough temperature (°C)")).toBeOnTheScreen();
    fireEvent.changeText(internal, "120");
    fireEvent.changeText(screen.getByTestId("formula-ddt"), "50");
    fireEvent.press(screen.getByTestId("formula-save"));
    expect(await screen.findByTestId("formula-internal-error")).toHaveTextContent("Target internal temperature can be at most 100.");
    expect(screen.getByTestId("formula-ddt-error")).toHaveTextContent("Desired dough temperature can be at most 40.");
    expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(0);
  });

  it("saves an edit as the next version with its note", async () => {
    const api = mockApi(routes(BAKER, { "PUT /api/formulas/:id": (req: FakeRequest) => ({ body: { formula: { ...formulaDto(), version: 3, name: (req.body as FormulaDto).name } } }) }));
    renderApp("/bake/formulas/1");
    fireEvent.changeText(await screen.findByTestId("line-1-percent"), "62");
    fireEvent.changeText(screen.getByTestId("formula-note"), "More milk for a softer crumb");
    expect(screen.getByTestId("formula-save")).toHaveTextContent(/Save as version 3/);
    fireEvent.press(screen.getByTestId("formula-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(1));
    const body = api.callsTo("PUT", "/api/formulas/1")[0].body as Record<string, unknown>;
    expect(body).toMatchObject({
      name: "Milk bread",
      lossPercent: 2,
      ddtC: 26,
      frictionC: 12,
      targetInternalC: 89,
      paste: { flourIngredientId: 1, liquidIngredientId: 2, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
      note: "More milk for a softer crumb",
    });
    expect((body.lines as { ingredientId: number; percent: number }[])[1]).toEqual({ ingredientId: 2, percent: 62 });
    expect(body.steps).toEqual([
      { kind: "paste", minutes: 40 },
      { kind: "mix", minutes: 15 },
      { kind: "bulk", minutes: 60 },
      { kind: "bake", minutes: 27, temperatureC: 177 },
      { kind: "cool", minutes: 30 },
    ]);
    expect(await screen.findByTestId("formula-saved")).toHaveTextContent(/Milk bread is saved as version 3\./);
  });

  it("puts the server's field errors next to their fields", async () => {
    mockApi(routes(BAKER, { "PUT /api/formulas/:id": apiError(400, "validation_error", "This ingredient is not in the library.", { "lines.6.ingredientId": "This ingredient is not in the library." }) }));
    renderApp("/bake/formulas/1");
    fireEvent.press(await screen.findByTestId("formula-save"));
    expect(await screen.findByTestId("line-6-ingredient-error")).toHaveTextContent("This ingredient is not in the library.");
    expect(screen.queryByTestId("formula-form-error")).toBeNull();
  });

  it("shows a name clash at the top", async () => {
    mockApi(routes(BAKER, { "PUT /api/formulas/:id": apiError(409, "name_taken", "Another formula has this name.") }));
    renderApp("/bake/formulas/1");
    fireEvent.press(await screen.findByTestId("formula-save"));
    expect(await screen.findByTestId("formula-form-error")).toHaveTextContent(/Another formula has this name\./);
  });

  it("edits lines and steps: add, pick an ingredient, remove, reorder", async () => {
    const api = mockApi(routes(BAKER, { "PUT /api/formulas/:id": { body: { formula: formulaDto({ version: 3 }) } } }));
    renderApp("/bake/formulas/1");
    fireEvent.press(await screen.findByTestId("add-line"));
    fireEvent.press(screen.getByTestId("formula-save"));
    expect(screen.getByTestId("line-7-ingredient-error")).toHaveTextContent("Choose an ingredient.");
    fireEvent.press(screen.getByTestId("line-7-ingredient"));
    fireEvent.press(screen.getByTestId("line-7-ingredient-option-10"));
    fireEvent.changeText(screen.getByTestId("line-7-percent"), "4");
    expect(screen.getByTestId("figure-hydration")).toHaveTextContent("62 %");
    fireEvent.press(screen.getByTestId("line-4-remove"));
    fireEvent.press(screen.getByTestId("step-1-up"));
    fireEvent.press(screen.getByTestId("formula-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/formulas/1")).toHaveLength(1));
    const body = api.callsTo("PUT", "/api/formulas/1")[0].body as { lines: { ingredientId: number }[]; steps: { kind: string }[] };
    expect(body.lines.map((l) => l.ingredientId)).toEqual([1, 2, 5, 4, 7, 8, 10]);
    expect(body.steps.map((s) => s.kind)).toEqual(["mix", "paste", "bulk", "bake", "cool"]);
  });

  it("lists the versions and opens an earlier one read-only", async () => {
    mockApi(routes());
    renderApp("/bake/formulas/1");
    const history = await screen.findByTestId("formula-history");
    expect(await within(history).findByTestId("history-2")).toHaveTextContent(/Version 2.*Current.*More milk/);
    expect(within(history).getByTestId("history-1")).toHaveTextContent(/Version 1.*First written/);
    fireEvent.press(screen.getByTestId("history-1-open"));
    expect(await screen.findByTestId("formula-old-version")).toHaveTextContent(/You are reading version 1, read-only\. The current version is 2\./);
    expect(screen.getByTestId("formula-readonly-lines")).toHaveTextContent(/Whole milk.*55 %/);
    expect(screen.getByTestId("formula-readonly-figures")).toBeOnTheScreen();
    expect(screen.queryByTestId("formula-save")).toBeNull();
    expect(screen.getByTestId("history-1")).toHaveTextContent(/Reading/);
  });

  it("adds a new formula after checking it", async () => {
    const api = mockApi(routes(BAKER, {
      "POST /api/formulas": { status: 201, body: { formula: formulaDto({ id: 5, name: "Potato milk bread", version: 1 }) } },
      "GET /api/formulas/:id": { body: { formula: formulaDto({ id: 5, name: "Potato milk bread", version: 1 }) } },
      "GET /api/formulas/:id/history": { body: { versions: [{ version: 1, note: "", editedById: 1, createdAt: "2025-12-02T10:00:00.000Z" }] satisfies FormulaVersionDto[] } },
    }));
    const app = renderApp("/bake/formulas/new");
    fireEvent.press(await screen.findByTestId("formula-save"));
    expect(screen.getByTestId("formula-name-error")).toHaveTextContent("Name the dough.");
    expect(screen.getByTestId("line-0-ingredient-error")).toHaveTextContent("Choose an ingredient.");
    expect(screen.getByTestId("step-0-minutes-error")).toHaveTextContent("Enter whole minutes.");
    expect(screen.getByTestId("formula-form-error")).toHaveTextContent(/Some fields need attention\./);
    fireEvent.changeText(screen.getByTestId("formula-name"), "Potato milk bread");
    fireEvent.press(screen.getByTestId("line-0-ingredient"));
    fireEvent.press(screen.getByTestId("line-0-ingredient-option-1"));
    fireEvent.press(screen.getByTestId("add-line"));
    fireEvent.press(screen.getByTestId("line-1-ingredient"));
    fireEvent.press(screen.getByTestId("line-1-ingredient-option-2"));
    fireEvent.changeText(screen.getByTestId("line-1-percent"), "60");
    for (let i = 0; i < 7; i++) fireEvent.changeText(screen.getByTestId(`step-${i}-minutes`), "20");
    fireEvent.press(screen.getByTestId("formula-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/formulas")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/formulas")[0].body).toMatchObject({ name: "Potato milk bread", lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 2, percent: 60 }], paste: null });
    expect(await screen.findByTestId("formula-saved")).toHaveTextContent(/Formula added/);
    expect(app.getPathname()).toBe("/bake/formulas/5");
  });

  it("lets the owner link products to a formula (PATCH /api/products/:id)", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes(OWNER, { "PATCH /api/products/:id": (req: FakeRequest, p: Record<string, string>) => ({ body: { product: product({ id: Number(p.id), ...(req.body as object) }) } }) }));
    renderApp("/office/production/formulas/1");
    fireEvent.press(await screen.findByTestId("formula-products-102"));
    fireEvent.press(screen.getByTestId("formula-products-101"));
    fireEvent.press(screen.getByTestId("formula-products-save"));
    await waitFor(() => expect(api.calls.filter((c) => c.method === "PATCH")).toHaveLength(2));
    expect(api.callsTo("PATCH", "/api/products/102")[0].body).toEqual({ formulaId: 1 });
    expect(api.callsTo("PATCH", "/api/products/101")[0].body).toEqual({ formulaId: null });
    expect(await screen.findByTestId("formula-products-saved")).toBeOnTheScreen();
  });

  it("shows the baker which products use it, without the owner's controls", async () => {
    mockApi(routes());
    renderApp("/bake/formulas/1");
    expect(await screen.findByTestId("formula-products-list")).toHaveTextContent("Milk-bread dinner rolls");
    expect(screen.queryByTestId("formula-products-save")).toBeNull();
  });
});
