/** The owner's price lists (components/screens/pricing): the list, and the form on the one form hook. */
import { fireEvent, screen } from "expo-router/testing-library";
import { OWNER, PRODUCTS, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest } from "./helpers";
import type { PriceListDto } from "../../shared/schemas/catalog";

const PARTNERS: PriceListDto = { id: 5, name: "Café partners", kind: "percent", percentOff: 10, items: [], accountCount: 2, accounts: [{ id: 11, businessName: "Tidewater Café" }, { id: 12, businessName: "Juniper Table" }] } as PriceListDto;

function routes(extra: Record<string, unknown> = {}) {
  return { ...sessionRoutes(OWNER), "GET /api/price-lists": { body: { priceLists: [PARTNERS] } }, "GET /api/products": { body: { products: PRODUCTS } }, ...extra } as Parameters<typeof mockApi>[0];
}

describe("price lists", () => {
  it("lists each price list with what it does and how many accounts use it", async () => {
    signedInAs(OWNER);
    mockApi(routes());
    renderApp("/office/price-lists");
    expect(await screen.findByTestId("price-list-5")).toHaveTextContent(/Café partners.*10 % off list prices.*Used by 2 accounts/);
    expect(screen.getByTestId("price-list-5-accounts")).toHaveTextContent("Tidewater Café, Juniper Table");
  });

  it("names the accounts on a price list, each a link to its page (issue 12)", async () => {
    signedInAs(OWNER);
    mockApi(routes());
    renderApp("/office/price-lists/5");
    expect(await screen.findByTestId("price-list-account-11")).toHaveTextContent("Tidewater Café");
    expect(screen.getByTestId("price-list-account-12")).toHaveTextContent("Juniper Table");
  });

  it("checks own prices before sending: an unreadable price beside its product, none at all above the list", async () => {
    signedInAs(OWNER);
    const api = mockApi(routes({ "POST /api/price-lists": (req: FakeRequest) => ({ status: 201, body: { priceList: { ...PARTNERS, id: 6, kind: "fixed", name: String((req.body as { name: string }).name) } } }) }));
    renderApp("/office/price-lists/new");
    fireEvent.changeText(await screen.findByTestId("price-list-name"), "Hotel rates");
    fireEvent.press(screen.getByTestId("price-list-kind-fixed"));
    fireEvent.press(screen.getByTestId("price-list-save"));
    expect(screen.getByTestId("price-list-items-error")).toHaveTextContent("Set a price for at least one product.");
    fireEvent.changeText(screen.getByTestId("price-list-price-102"), "twelve");
    fireEvent.press(screen.getByTestId("price-list-save"));
    expect(screen.getByTestId("price-list-price-102-error")).toHaveTextContent("Write it in dollars and cents, like 16.50.");
    expect(screen.queryByTestId("price-list-items-error")).toBeNull();
    expect(api.callsTo("POST", "/api/price-lists")).toHaveLength(0);
    fireEvent.changeText(screen.getByTestId("price-list-price-102"), "14.25");
    fireEvent.press(screen.getByTestId("price-list-save"));
    expect(await screen.findByTestId("price-lists-notice")).toHaveTextContent(/Hotel rates is made. Choose it on an account.s page to use it./);
    expect(api.callsTo("POST", "/api/price-lists")[0].body).toEqual({ name: "Hotel rates", kind: "fixed", percentOff: 0, items: [{ productId: 102, priceCents: 1425 }] });
  });

  it("shows the server's field errors beside the name", async () => {
    signedInAs(OWNER);
    mockApi(routes({ "PUT /api/price-lists/:id": apiError(409, "validation_failed", "Check the name.", { name: "A price list has this name." }) }));
    renderApp("/office/price-lists/5");
    fireEvent.press(await screen.findByTestId("price-list-save"));
    expect(await screen.findByTestId("price-list-name-error")).toHaveTextContent("A price list has this name.");
    expect(screen.queryByTestId("price-list-form-error")).toBeNull();
  });
});
