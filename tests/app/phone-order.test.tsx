import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, PRODUCTS, account, apiError, mockApi, orderDto, renderApp, sessionRoutes, signedInAs } from "./helpers";

/** Issue 12: the office takes an order by phone for an account; past the cut-off only the owner may, with a reason. */
const LATE = "Orders for Wed, Dec 3 closed at the cut-off, Tue, Dec 2, 2:00 PM CST. Call the bakery if something has gone wrong.";
const CUTOFF = { cutoffAt: "2025-12-02T14:00:00.000-06:00" };

function routes(user: typeof OWNER, post: (body: Record<string, unknown>) => object) {
  return {
    ...sessionRoutes(user),
    "GET /api/accounts/:id": { body: { account: account() } },
    "GET /api/products": { body: { products: PRODUCTS } },
    "GET /api/orders": { body: { orders: [] } },
    "POST /api/orders": (req: { body: unknown }) => post(req.body as Record<string, unknown>),
  };
}

describe("order by phone", () => {
  it("the owner places an order past the cut-off only after confirming it with a reason, which the order keeps", async () => {
    signedInAs(OWNER);
    const api = mockApi(
      routes(OWNER, (body) =>
        body.cutoffOverride
          ? { status: 201, body: { order: orderDto({ totalCents: 7200, cutoffOverride: { at: "2025-12-02T21:00:00.000Z", reason: (body.cutoffOverride as { reason: string }).reason, byId: 1 } }) } }
          : { status: 409, body: { error: { code: "cutoff_passed", message: LATE, ...CUTOFF } } },
      ),
    );
    renderApp("/office/accounts/11/order?date=2025-12-03");
    await waitFor(() => expect(screen.getByTestId("phone-order-existing")).toHaveTextContent("No order for Wed, Dec 3 yet."));
    fireEvent.changeText(screen.getByTestId("phone-qty-101"), "4");
    expect(screen.getByTestId("phone-order-estimate")).toHaveTextContent("About $72.00 at list prices");
    fireEvent.press(screen.getByTestId("phone-order-submit"));
    expect(await screen.findByTestId("phone-order-late")).toHaveTextContent(/^Orders for Wed, Dec 3 closed at the cut-off, Tue, Dec 2, 2:00 PM CST\.The cut-off protects the bake/);
    // The confirmation needs a reason first.
    expect(screen.getByTestId("phone-order-override")).toBeDisabled();
    fireEvent.changeText(screen.getByTestId("phone-order-reason"), "Phoned at 3 pm; the oven has room");
    fireEvent.press(screen.getByTestId("phone-order-override"));
    expect(await screen.findByTestId("phone-order-done")).toHaveTextContent(/Order placed for Tidewater Café on Wed, Dec 3: \$72\.00\. Taken past the cut-off: Phoned at 3 pm; the oven has room\./);
    const posts = api.callsTo("POST", "/api/orders");
    expect(posts).toHaveLength(2);
    expect(posts[0].body).toMatchObject({ accountId: 11, deliveryDate: "2025-12-03", lines: [{ productId: 101, quantity: 4 }] });
    expect(posts[0].body).not.toHaveProperty("cutoffOverride");
    expect(posts[1].body).toMatchObject({ cutoffOverride: { confirm: true, reason: "Phoned at 3 pm; the oven has room" } });
  });

  it("the bookkeeper takes orders before the cut-off, and is told only the owner can set it aside", async () => {
    signedInAs(BOOKKEEPER);
    mockApi(routes(BOOKKEEPER, () => apiError(409, "cutoff_passed", LATE)));
    renderApp("/office/accounts/11/order?date=2025-12-03");
    fireEvent.changeText(await screen.findByTestId("phone-qty-101"), "2");
    fireEvent.press(screen.getByTestId("phone-order-submit"));
    expect(await screen.findByTestId("phone-order-owner-only")).toHaveTextContent("Only the owner can take or change an order past its cut-off.");
    expect(screen.queryByTestId("phone-order-override")).toBeNull();
  });

  it("opens from the account page and changes the date's existing order", async () => {
    signedInAs(OWNER);
    const api = mockApi({
      ...routes(OWNER, () => ({ status: 500, body: {} })),
      "GET /api/orders": { body: { orders: [orderDto()] } },
      "PATCH /api/orders/:id": (req: { body: unknown }) => ({ body: { order: orderDto({ lines: [], totalCents: 9000, ...(req.body as object) }) } }),
    });
    const app = renderApp("/office/accounts/11");
    fireEvent.press(await screen.findByTestId("phone-order-link"));
    await waitFor(() => expect(app.getPathname()).toBe("/office/accounts/11/order"));
    await waitFor(() => expect(screen.getByTestId("phone-order-existing")).toHaveTextContent(/already has an order for .*\(\$54\.00\): change it below\./));
    expect(screen.getByTestId("phone-qty-101")).toHaveDisplayValue("3");
    fireEvent.changeText(screen.getByTestId("phone-qty-101"), "5");
    fireEvent.press(screen.getByTestId("phone-order-submit"));
    await waitFor(() => expect(api.callsTo("PATCH", "/api/orders/501")).toHaveLength(1));
    expect(api.callsTo("PATCH", "/api/orders/501")[0].body).toMatchObject({ lines: [{ productId: 101, quantity: 5 }] });
    expect(await screen.findByTestId("phone-order-done")).toHaveTextContent(/Order saved for Tidewater Café/);
  });
});
