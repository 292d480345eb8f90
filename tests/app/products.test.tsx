import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, PRODUCTS, apiError, mockApi, product, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { EMPTY_PRODUCT, checkProduct } from "../../components/screens/products/ProductFormScreen";
import { productsApi } from "../../components/api/products";

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
    expect(screen.getByTestId("product-price-error")).toHaveTextContent("Enter the price.");
    expect(screen.getByTestId("product-form-error")).toHaveTextContent(/Some fields need attention\./);
    await fillRequired();
    fireEvent.changeText(screen.getByTestId("product-price"), "14.999");
    fireEvent.changeText(screen.getByTestId("product-minQuantity"), "6");
    fireEvent.changeText(screen.getByTestId("product-maxQuantity"), "3");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(screen.getByTestId("product-price-error")).toHaveTextContent("Write the price in dollars and cents, like 18.00.");
    expect(screen.getByTestId("product-maxQuantity-error")).toHaveTextContent("The maximum must be at least the minimum.");
    expect(api.callsTo("POST", "/api/products")).toHaveLength(0);
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
      priceCents: 1440,
      panLengthMm: 457,
      panWidthMm: 330,
      leadDays: null,
      allergens: ["wheat", "milk"],
      mayContain: "sesame",
      active: true,
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
    fireEvent.changeText(screen.getByTestId("product-price"), "9.50");
    fireEvent.press(screen.getByTestId("product-save"));
    expect(await screen.findByTestId("product-saleUnit-error")).toHaveTextContent("Use at most 60 characters.");
  });

  it("checkProduct turns a blank notice into null and keeps unknown trace notes", () => {
    const r = checkProduct({ ...EMPTY_PRODUCT, name: "A", saleUnit: "loaf", piecesPerUnit: "1", pieceGrams: "900", panName: "Pullman", panLengthMm: "330", panWidthMm: "100", price: "9.5", mayContain: ["tree_nuts"], mayContainOther: ["shared fryer"] });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.input.priceCents).toBe(950);
      expect(r.input.leadDays).toBeNull();
      expect(r.input.mayContain).toBe("tree_nuts,shared fryer");
    }
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
