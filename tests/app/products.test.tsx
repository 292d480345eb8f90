import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, PRODUCTS, apiError, mockApi, product, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { EMPTY_PRODUCT, checkProduct, previewAllergens } from "../../components/screens/products/ProductFormScreen";
import { productsApi } from "../../components/api/products";
import { INGREDIENTS, formulaDto, ingredient } from "./production-fixtures";

/** The library with a sesame topping ingredient; a brioche formula (egg, milk, wheat) beside the milk bread. */
const LIBRARY = [...INGREDIENTS, ingredient({ id: 20, name: "Toasted sesame seeds", kind: "inclusion", waterPercent: 2, allergens: ["sesame"], packName: "5 lb bag", packGrams: 2268, packCostCents: 1650 })];
const FORMULAS = [formulaDto(), formulaDto({ id: 3, name: "Brioche", steps: [{ kind: "bake", minutes: 16, temperatureC: 190 }, { kind: "cool", minutes: 30 }], productIds: [] })];
const kitchenRoutes = { "GET /api/formulas": { body: { formulas: FORMULAS } }, "GET /api/ingredients": { body: { ingredients: LIBRARY } } };

const ALL = [...PRODUCTS, product({ id: 103, name: "Old seeded loaf", active: false })];

describe("products list", () => {
  it("filters on offer, archived and all", async () => {
    signedInAs(OWNER);
    const api = mockApi({ ...sessionRoutes(OWNER), "GET /api/products": { body: { products: ALL } } });
    renderApp("/office/products");
    expect(await screen.findByTestId("product-row-101")).toBeOnTheScreen();
    expect(screen.queryByTestId("product-row-103")).toBeNull();
    expect(api.callsTo("GET", "/api/products")[0].query.all).toBe("1");
    fireEvent.press(screen.getByTestId("products-filter-archived"));
    expect(screen.getByTestId("product-row-103")).toHaveTextContent(/Archived/);
    expect(screen.queryByTestId("product-row-101")).toBeNull();
    fireEvent.press(screen.getByTestId("products-filter-all"));
    expect(screen.getByTestId("product-row-101")).toBeOnTheScreen();
    expect(screen.getByTestId("new-product")).toBeOnTheScreen();
  });

  it("searches by name, sale unit or description (accents and case ignored) and sorts (issue 12)", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/products": { body: { products: [...ALL, product({ id: 104, name: "Crème brioche loaf", listPriceCents: 1700, priceCents: 1700 })] } } });
    renderApp("/office/products");
    await screen.findByTestId("product-row-101");
    fireEvent.changeText(screen.getByTestId("products-search"), "creme");
    expect(screen.getByTestId("product-row-104")).toBeOnTheScreen();
    expect(screen.queryByTestId("product-row-101")).toBeNull();
    fireEvent.changeText(screen.getByTestId("products-search"), "burger BUNS");
    expect(screen.getByTestId("product-row-102")).toBeOnTheScreen();
    expect(screen.queryByTestId("product-row-101")).toBeNull();
    fireEvent.changeText(screen.getByTestId("products-search"), "tray rolls");
    expect(screen.getByTestId("product-row-101")).toBeOnTheScreen();
    expect(screen.queryByTestId("product-row-102")).toBeNull();
    fireEvent.changeText(screen.getByTestId("products-search"), "focaccia");
    expect(screen.getByTestId("products-no-match")).toHaveTextContent(/Nothing matches “focaccia”Try part of the name/);
    fireEvent.changeText(screen.getByTestId("products-search"), "");
    // Price, high to low: the rolls ($18.00 list), the crème loaf ($17.00), the brioche buns ($16.00); and back.
    fireEvent.press(screen.getByTestId("products-sort-price_desc"));
    const rows = screen.getAllByTestId(/^product-row-/).map((r) => r.props.testID);
    expect(rows).toEqual(["product-row-101", "product-row-104", "product-row-102"]);
    fireEvent.press(screen.getByTestId("products-sort-price"));
    expect(screen.getAllByTestId(/^product-row-/).map((r) => r.props.testID)).toEqual(["product-row-102", "product-row-104", "product-row-101"]);
    fireEvent.press(screen.getByTestId("products-sort-name"));
    expect(screen.getAllByTestId(/^product-row-/).map((r) => r.props.testID)).toEqual(["product-row-102", "product-row-104", "product-row-101"]); // Brioche…, Crème…, Milk-bread…
  });

  it("shows the bookkeeper a read-only list and product", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/products": { body: { products: ALL } }, "GET /api/products/:id": { body: { product: PRODUCTS[0] } } });
    renderApp("/office/products");
    fireEvent.press(await screen.findByTestId("product-row-101"));
    expect(await screen.findByTestId("product-facts")).toHaveTextContent(/330 × 229 mm \(13 in × 9 in\)/);
    expect(screen.queryByTestId("new-product")).toBeNull();
    expect(screen.queryByTestId("product-form")).toBeNull();
  });
});

describe("product form", () => {
  beforeEach(() => signedInAs(OWNER));

  async function fillRequired() {
    await screen.findByTestId("product-name");
    fireEvent.changeText(screen.getByTestId("product-name"), "Potato milk buns");
    fireEvent.changeText(screen.getByTestId("product-saleUnit"), "dozen buns");
    fireEvent.changeText(screen.getByTestId("product-piecesPerUnit"), "12");
    fireEvent.changeText(screen.getByTestId("product-pieceGrams"), "50");
    fireEvent.changeText(screen.getByTestId("product-panName"), "Half-sheet pan");
    fireEvent.changeText(screen.getByTestId("product-panLengthMm"), "457");
    fireEvent.changeText(screen.getByTestId("product-panWidthMm"), "330");
  }

  it("checks the fields with the shared schema before sending", async () => {
    const api = mockApi({ ...sessionRoutes(OWNER) });
    renderApp("/office/products/new");
    fireEvent.press(await screen.findByTestId("product-save"));
    expect(screen.getByTestId("product-name-error")).toHaveTextContent("Enter the product's name.");
    expect(screen.getByTestId("product-price-error")).toHaveTextContent("Enter the list price.");
    expect(screen.getByTestId("product-form-error")).toHaveTextContent(/Some fields need attention\./);
    await fillRequired();
    fireEvent.changeText(screen.getByTestId("product-price"), "14.999");
    fireEvent.changeText(screen.getByTestId("product-minQuantity"), "6");
    fireEvent.changeText(screen.getByTestId("product-maxQuantity"), "3");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-price-error")).toHaveTextContent("Write the list price in dollars and cents, like 18.00.");
    expect(screen.getByTestId("product-maxQuantity-error")).toHaveTextContent("The maximum per order must be at least the minimum per order.");
    expect(api.callsTo("POST", "/api/products")).toHaveLength(0);
  });

  it("names each field in its error the way its label does: days of notice, minimum and maximum per order, list price", async () => {
    mockApi({ ...sessionRoutes(OWNER) });
    renderApp("/office/products/new");
    await fillRequired();
    expect(screen.getByLabelText("Days of notice")).toBeOnTheScreen();
    expect(screen.getByLabelText("Minimum per order")).toBeOnTheScreen();
    expect(screen.getByLabelText("Maximum per order")).toBeOnTheScreen();
    expect(screen.getByLabelText("List price")).toBeOnTheScreen();
    fireEvent.changeText(screen.getByTestId("product-leadDays"), "20");
    fireEvent.changeText(screen.getByTestId("product-minQuantity"), "0");
    fireEvent.changeText(screen.getByTestId("product-maxQuantity"), "20000");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-leadDays-error")).toHaveTextContent("Days of notice can be at most 14.");
    expect(screen.getByTestId("product-minQuantity-error")).toHaveTextContent("Minimum per order must be at least 1.");
    expect(screen.getByTestId("product-maxQuantity-error")).toHaveTextContent("Maximum per order can be at most 10000.");
  });

  it("suggests the plural from the sale unit, keeps the owner's own once written, and needs one", async () => {
    mockApi({ ...sessionRoutes(OWNER) });
    renderApp("/office/products/new");
    await screen.findByTestId("product-saleUnit");
    fireEvent.changeText(screen.getByTestId("product-saleUnit"), "tray of 15 rolls");
    expect(screen.getByTestId("product-saleUnitPlural")).toHaveDisplayValue("trays of 15 rolls");
    fireEvent.changeText(screen.getByTestId("product-saleUnit"), "loaf");
    expect(screen.getByTestId("product-saleUnitPlural")).toHaveDisplayValue("loaves");
    fireEvent.changeText(screen.getByTestId("product-saleUnitPlural"), "loaves, sliced");
    fireEvent.changeText(screen.getByTestId("product-saleUnit"), "loaf, sliced");
    expect(screen.getByTestId("product-saleUnitPlural")).toHaveDisplayValue("loaves, sliced");
    fireEvent.changeText(screen.getByTestId("product-saleUnitPlural"), "");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-saleUnitPlural-error")).toHaveTextContent("Enter the plural of the sale unit, e.g. trays of 15 rolls.");
  });

  it("shows the pan size in inches and sends chosen allergens as codes", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "POST /api/products": { status: 201, body: { product: product({ id: 120, name: "Potato milk buns" }) } },
      "GET /api/products/:id": { body: { product: product({ id: 120, name: "Potato milk buns" }) } },
    });
    renderApp("/office/products/new");
    await fillRequired();
    expect(screen.getByText("= 18 in")).toBeOnTheScreen();
    expect(screen.getByText("= 13 in")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("product-making-bought_in"));
    fireEvent.changeText(screen.getByTestId("product-price"), "$14.40");
    fireEvent.press(screen.getByTestId("product-allergens-milk"));
    fireEvent.press(screen.getByTestId("product-allergens-wheat"));
    fireEvent.press(screen.getByTestId("product-allergens-egg"));
    fireEvent.press(screen.getByTestId("product-allergens-egg")); // and off again
    fireEvent.press(screen.getByTestId("product-mayContain-sesame"));
    expect(screen.getByTestId("product-allergens-milk")).toBeChecked();
    expect(screen.getByTestId("product-allergens-egg")).not.toBeChecked();
    expect(screen.getByTestId("product-allergen-preview")).toHaveTextContent(/Wheat.*Milk.*May contain: Sesame/);
    fireEvent.press(screen.getByTestId("product-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/products")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/products")[0].body).toMatchObject({
      name: "Potato milk buns",
      saleUnit: "dozen buns",
      saleUnitPlural: "dozen buns",
      priceCents: 1440,
      panLengthMm: 457,
      panWidthMm: 330,
      leadDays: null,
      allergens: ["wheat", "milk"],
      mayContain: "sesame",
      active: true,
      boughtIn: true,
      formulaId: null,
      components: [],
    });
    expect(await screen.findByTestId("product-saved")).toHaveTextContent(/Product added/);
  });

  it("puts the server's field errors next to the fields", async () => {
    mockApi({
      ...sessionRoutes(OWNER),
      "POST /api/products": apiError(400, "validation_failed", "Use at most 60 characters.", { saleUnit: "Use at most 60 characters." }),
    });
    renderApp("/office/products/new");
    await fillRequired();
    fireEvent.press(screen.getByTestId("product-making-bought_in"));
    fireEvent.changeText(screen.getByTestId("product-price"), "9.50");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(await screen.findByTestId("product-saleUnit-error")).toHaveTextContent("Use at most 60 characters.");
  });

  it("checkProduct turns a blank notice into null and keeps unknown trace notes", () => {
    const r = checkProduct({ ...EMPTY_PRODUCT, name: "A", saleUnit: "loaf", saleUnitPlural: "loaves", piecesPerUnit: "1", pieceGrams: "900", panName: "Pullman", panLengthMm: "330", panWidthMm: "100", price: "9.5", making: "bought_in", mayContain: ["tree_nuts"], mayContainOther: ["shared fryer"] });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.input.priceCents).toBe(950);
      expect(r.input.leadDays).toBeNull();
      expect(r.input.mayContain).toBe("tree_nuts,shared fryer");
    }
  });
});

describe("product form: how it's made", () => {
  beforeEach(() => signedInAs(OWNER));

  async function fillRequired() {
    await screen.findByTestId("product-name");
    fireEvent.changeText(screen.getByTestId("product-name"), "Sesame milk buns");
    fireEvent.changeText(screen.getByTestId("product-saleUnit"), "dozen buns");
    fireEvent.changeText(screen.getByTestId("product-piecesPerUnit"), "12");
    fireEvent.changeText(screen.getByTestId("product-pieceGrams"), "50");
    fireEvent.changeText(screen.getByTestId("product-panName"), "Half-sheet pan");
    fireEvent.changeText(screen.getByTestId("product-panLengthMm"), "457");
    fireEvent.changeText(screen.getByTestId("product-panWidthMm"), "330");
    fireEvent.changeText(screen.getByTestId("product-price"), "15.00");
  }

  it("a new product cannot go on offer with neither a formula nor the bought-in choice", async () => {
    const api = mockApi({ ...sessionRoutes(OWNER), ...kitchenRoutes });
    renderApp("/office/products/new");
    await fillRequired();
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-making-error")).toHaveTextContent("Choose the formula it is baked from, or mark it bought in / not planned: otherwise buyers could order what production cannot plan.");
    fireEvent.press(screen.getByTestId("product-making-formula"));
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-formula-error")).toHaveTextContent("Choose the formula it is baked from.");
    expect(api.callsTo("POST", "/api/products")).toHaveLength(0);
  });

  it("picks the formula, adds component rows, shows the derived allergens it cannot take off, and sends it all", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      ...kitchenRoutes,
      "POST /api/products": { status: 201, body: { product: product({ id: 130, name: "Sesame milk buns" }) } },
      "GET /api/products/:id": { body: { product: product({ id: 130, name: "Sesame milk buns" }) } },
    });
    renderApp("/office/products/new");
    await fillRequired();
    fireEvent.press(screen.getByTestId("product-making-formula"));
    fireEvent.press(await screen.findByTestId("product-formula"));
    fireEvent.press(await screen.findByTestId("product-formula-option-1"));
    // The formula's bake and cool steps are the defaults the blank fields stand for.
    expect(screen.getByText("Blank: the formula's 27 min.")).toBeOnTheScreen();
    expect(screen.getByText("Blank: the formula's 177 °C.")).toBeOnTheScreen();
    fireEvent.changeText(screen.getByTestId("product-bakeMinutes"), "16");
    expect(screen.getByTestId("product-derived-allergens")).toHaveTextContent(/Egg — Milk bread dough/);
    expect(screen.queryByTestId("product-derived-sesame")).toBeNull();

    expect(screen.getByTestId("product-components-empty")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("add-component"));
    fireEvent.changeText(screen.getByTestId("component-0-name"), "Sesame topping");
    fireEvent.press(screen.getByTestId("component-0-ingredient"));
    fireEvent.press(await screen.findByTestId("component-0-ingredient-option-20"));
    fireEvent.changeText(screen.getByTestId("component-0-grams"), "2");
    // A second line, then removed again.
    fireEvent.press(screen.getByTestId("add-component"));
    expect(screen.getByTestId("component-1-name").props.value).toBe("Sesame topping"); // a new line continues the last component
    fireEvent.press(screen.getByTestId("component-1-remove"));
    expect(screen.queryByTestId("component-1")).toBeNull();

    // Sesame now comes from the topping: shown, and not offered as something to untick.
    expect(screen.getByTestId("product-derived-sesame")).toHaveTextContent("Sesame — Sesame topping");
    expect(screen.queryByTestId("product-allergens-sesame")).toBeNull();
    expect(screen.queryByTestId("product-allergens-egg")).toBeNull();
    fireEvent.press(screen.getByTestId("product-allergens-mustard"));
    expect(screen.getByTestId("product-allergen-preview")).toHaveTextContent(/Egg.*Milk.*Mustard.*Sesame/);

    fireEvent.press(screen.getByTestId("product-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/products")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/products")[0].body).toMatchObject({
      name: "Sesame milk buns",
      formulaId: 1,
      boughtIn: false,
      bakeTempC: null,
      bakeMinutes: 16,
      coolMinutes: null,
      components: [{ kind: "topping", name: "Sesame topping", ingredientId: 20, grams: 2, per: "piece", note: "" }],
      allergens: ["gluten", "wheat", "egg", "milk", "mustard", "sesame"],
    });
  });

  it("edits a product's components: rows from the server, per pan, the server's row errors beside the row", async () => {
    const sesameBuns = product({
      id: 140, name: "Sesame brioche buns", formulaId: 3, formulaName: "Brioche", boughtIn: false,
      allergens: ["gluten", "wheat", "egg", "milk", "sesame"], derivedAllergens: ["gluten", "wheat", "egg", "milk", "sesame"], addedAllergens: [],
      allergenSources: { gluten: ["Brioche dough"], wheat: ["Brioche dough"], egg: ["Brioche dough", "Egg wash"], milk: ["Brioche dough", "Egg wash"], sesame: ["Toasted sesame topping"] },
      components: [
        { kind: "wash", name: "Egg wash", ingredientId: 5, ingredientName: "Whole egg", grams: 1.2, per: "piece", note: "", allergens: ["egg"] },
        { kind: "topping", name: "Toasted sesame topping", ingredientId: 20, ingredientName: "Toasted sesame seeds", grams: 2, per: "piece", note: "", allergens: ["sesame"] },
      ],
      formulaBake: { bakeTempC: 190, bakeMinutes: 16, coolMinutes: 30 }, bake: { bakeTempC: 190, bakeMinutes: 16, coolMinutes: 30 },
    });
    const api = mockApi({
      ...sessionRoutes(OWNER),
      ...kitchenRoutes,
      "GET /api/products/:id": { body: { product: sesameBuns } },
      "PATCH /api/products/:id": apiError(400, "validation_failed", "Weigh at least 0.1 g.", { "components.1.grams": "Weigh at least 0.1 g." }),
    });
    renderApp("/office/products/140");
    await waitFor(() => expect(screen.getByTestId("component-1-ingredient")).toHaveTextContent(/Toasted sesame seeds/));
    expect(screen.getByTestId("product-formula")).toHaveTextContent(/Brioche/);
    await waitFor(() => expect(screen.getByTestId("product-derived-sesame")).toHaveTextContent("Sesame — Toasted sesame topping"));
    expect(screen.getByTestId("product-derived-egg")).toHaveTextContent("Egg — Brioche dough, Egg wash");
    fireEvent.press(screen.getByTestId("component-0-per-pan"));
    fireEvent.press(screen.getByTestId("product-save"));
    expect(await screen.findByTestId("component-1-grams-error")).toHaveTextContent("Weigh at least 0.1 g.");
    const body = api.callsTo("PATCH", "/api/products/140")[0].body as { components: unknown; allergens: unknown };
    expect(body.components).toEqual([
      { kind: "wash", name: "Egg wash", ingredientId: 5, grams: 1.2, per: "pan", note: "" },
      { kind: "topping", name: "Toasted sesame topping", ingredientId: 20, grams: 2, per: "piece", note: "" },
    ]);
    expect(body.allergens).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
  });

  it("choosing bought in hides the bake and components and sends none", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      ...kitchenRoutes,
      "POST /api/products": { status: 201, body: { product: product({ id: 131 }) } },
      "GET /api/products/:id": { body: { product: product({ id: 131 }) } },
    });
    renderApp("/office/products/new");
    await fillRequired();
    fireEvent.press(screen.getByTestId("product-making-formula"));
    fireEvent.press(await screen.findByTestId("add-component"));
    expect(screen.getByTestId("component-0")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("product-making-bought_in"));
    expect(screen.queryByTestId("component-0")).toBeNull();
    expect(screen.queryByTestId("product-bakeMinutes")).toBeNull();
    expect(screen.getByText("Contains")).toBeOnTheScreen(); // the whole declaration is the product's own
    fireEvent.press(screen.getByTestId("product-allergens-milk"));
    fireEvent.press(screen.getByTestId("product-save"));
    await waitFor(() => expect(api.callsTo("POST", "/api/products")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/products")[0].body).toMatchObject({ boughtIn: true, formulaId: null, components: [], bakeMinutes: null, allergens: ["milk"] });
  });

  it("shows the bookkeeper how it's made, its bake, its components and where each allergen comes from", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({
      ...sessionRoutes(BOOKKEEPER),
      "GET /api/products/:id": {
        body: {
          product: product({
            id: 150, formulaId: 1, formulaName: "Milk bread", boughtIn: false, bakeMinutes: 16,
            bake: { bakeTempC: 177, bakeMinutes: 16, coolMinutes: 30 }, formulaBake: { bakeTempC: 177, bakeMinutes: 27, coolMinutes: 30 },
            allergens: ["egg", "milk"], allergenSources: { egg: ["Milk bread dough", "Egg wash"], milk: ["Milk bread dough"] },
            components: [{ kind: "wash", name: "Egg wash", ingredientId: 5, ingredientName: "Whole egg", grams: 0.8, per: "piece", note: "", allergens: ["egg"] }],
          }),
        },
      },
    });
    renderApp("/office/products/150");
    const facts = await screen.findByTestId("product-facts");
    expect(facts).toHaveTextContent(/From the Milk bread formula/);
    expect(facts).toHaveTextContent(/16 min at 177 °C, then 30 min cooling/);
    expect(facts).toHaveTextContent(/Egg wash: Whole egg 0.8 g per piece/);
    expect(facts).toHaveTextContent(/Egg \(Milk bread dough, Egg wash\); Milk \(Milk bread dough\)/);
  });

  it("previewAllergens is the union: the product's own list adds to the derived one and never replaces it", () => {
    const values = { ...EMPTY_PRODUCT, making: "formula" as const, formulaId: 3, allergens: ["mustard" as const], components: [{ key: "k", kind: "topping" as const, name: "", ingredientId: 20, grams: "2", per: "piece" as const, note: "" }] };
    const d = previewAllergens(values, FORMULAS.map((f) => (f.id === 3 ? { ...f, allergens: ["gluten", "wheat", "egg", "milk"] } : f)), LIBRARY);
    expect(d.declared).toEqual(["gluten", "wheat", "egg", "milk", "mustard", "sesame"]);
    expect(d.derived).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    expect(d.sources.sesame).toEqual(["Topping"]); // a nameless component goes by its kind
  });
});

describe("photo upload", () => {
  it("maps the server's 415 and 413 answers to their messages", async () => {
    const reply = (status: number, message: string) => {
      (globalThis as { fetch?: unknown }).fetch = jest.fn(async () => ({ ok: false, status, text: async () => JSON.stringify({ error: { code: "x", message } }) }));
    };
    reply(415, "Upload a JPEG, PNG or WebP photo.");
    await expect(productsApi.uploadPhoto(1, { uri: "file:///a.txt", name: "a.txt", type: "text/plain" })).rejects.toThrow("Upload a JPEG, PNG or WebP photo.");
    reply(413, "The photo is larger than 5 MB. Use a smaller one.");
    await expect(productsApi.uploadPhoto(1, { uri: "file:///b.jpg", name: "b.jpg", type: "image/jpeg" })).rejects.toMatchObject({ status: 413, message: "The photo is larger than 5 MB. Use a smaller one." });
  });
});
