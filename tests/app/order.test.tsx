import { act, fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BUYER, apiError, buyerOrderingRoutes, calendarDay, mockApi, orderDto, renderApp, signedInAs } from "./helpers";

beforeEach(() => signedInAs(BUYER));

const DAY = calendarDay();

describe("order screen for a date", () => {
  it("steps quantities within the product's bounds and keeps a running total", async () => {
    mockApi(buyerOrderingRoutes(DAY));
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-title")).toHaveTextContent("Wednesday 3 December");
    expect(await screen.findByTestId("qty-101")).toBeOnTheScreen();
    expect(screen.getByTestId("order-total")).toHaveTextContent("$0.00");

    // The brioche buns come in 2 to 5 packs: + jumps from nothing to the minimum.
    fireEvent.press(screen.getByTestId("qty-102-inc"));
    expect(screen.getByTestId("qty-102")).toHaveDisplayValue("2");
    for (let i = 0; i < 6; i++) fireEvent.press(screen.getByTestId("qty-102-inc"));
    expect(screen.getByTestId("qty-102")).toHaveDisplayValue("5");
    expect(screen.getByTestId("qty-102-inc")).toBeDisabled();
    expect(screen.getByTestId("order-total")).toHaveTextContent("$80.00");

    // − from the minimum goes back to nothing.
    fireEvent.changeText(screen.getByTestId("qty-102"), "2");
    fireEvent.press(screen.getByTestId("qty-102-dec"));
    expect(screen.getByTestId("qty-102")).toHaveDisplayValue("0");
    expect(screen.getByTestId("qty-102-dec")).toBeDisabled();

    // Typed quantities count too; one over the maximum is flagged next to the line.
    fireEvent.changeText(screen.getByTestId("qty-101"), "3");
    expect(screen.getByTestId("order-total")).toHaveTextContent("$54.00");
    expect(screen.getByTestId("line-101-total")).toHaveTextContent("$54.00");
    fireEvent.changeText(screen.getByTestId("qty-101"), "41");
    expect(screen.getByTestId("line-101-error")).toHaveTextContent("At most 40 tray of 15 rolls per order.");
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("allergen-caution")).toBeOnTheScreen();
    expect(screen.getAllByText(/Allergens shown are a guide/)).toHaveLength(1);
    expect(screen.getAllByText("May contain: Sesame").length).toBeGreaterThan(0);
  });

  it("shows how much is missing to the account's minimum and places the order with an idempotency key", async () => {
    const api = mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": { status: 201, body: { order: orderDto({ lines: [], totalCents: 7200 }) } },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "2");
    expect(screen.getByTestId("order-minimum")).toHaveTextContent("Add $14.00 more to reach the $50.00 minimum.");
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    fireEvent.changeText(screen.getByTestId("qty-101"), "4");
    expect(screen.getByTestId("order-minimum")).toHaveTextContent("The $50.00 minimum order is met.");
    fireEvent.changeText(screen.getByTestId("order-po"), "PO-77");
    fireEvent.press(screen.getByTestId("order-submit"));
    await waitFor(() => expect(api.callsTo("POST", "/api/orders")).toHaveLength(1));
    const post = api.callsTo("POST", "/api/orders")[0];
    expect(post.body).toEqual({ deliveryDate: "2025-12-03", lines: [{ productId: 101, quantity: 4 }], poNumber: "PO-77" });
    expect(post.headers["Idempotency-Key"]).toMatch(/^[0-9a-f-]{32,36}$/);
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Order placed for Wednesday 3 December/);
  });

  it("reuses the idempotency key when the same order is sent again after a dropped connection", async () => {
    let attempt = 0;
    const api = mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": () => {
          attempt++;
          if (attempt === 1) throw new TypeError("Network request failed");
          return { status: 201, body: { order: orderDto({ lines: [], totalCents: 7200 }) } };
        },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "4");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-error-message")).toHaveTextContent(/can't be reached/);
    fireEvent.press(screen.getByTestId("order-submit"));
    await waitFor(() => expect(api.callsTo("POST", "/api/orders")).toHaveLength(2));
    const [first, second] = api.callsTo("POST", "/api/orders");
    expect(second.headers["Idempotency-Key"]).toBe(first.headers["Idempotency-Key"]);
  });

  it("shows the server's field error next to the line it names", async () => {
    mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": apiError(400, "validation_failed", "At least 2 pack of 8 buns per order.", { "lines.1.quantity": "At least 2 pack of 8 buns per order." }),
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "3");
    fireEvent.changeText(screen.getByTestId("qty-102"), "2");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("line-102-error")).toHaveTextContent("At least 2 pack of 8 buns per order.");
    expect(screen.queryByTestId("line-101-error")).toBeNull();
    expect(screen.getByTestId("order-error-message")).toHaveTextContent(/Check Brioche burger buns/);
  });

  it("locks the form when the server says the cut-off has passed", async () => {
    mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": apiError(409, "cutoff_passed", "Orders for Wed 3 Dec closed at the cut-off, Tue 2 Dec, 14:00 CST. Call the bakery if something has gone wrong."),
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "4");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-closed")).toHaveTextContent(/Orders for Wed 3 Dec closed at the cut-off, Tue 2 Dec, 14:00 CST/);
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("order-submit")).toHaveTextContent(/Ordering closed/);
    expect(screen.getByTestId("qty-101")).not.toBeEnabled();
    expect(screen.getByTestId("qty-101-inc")).toBeDisabled();
  });

  it("locks the form when the countdown reaches the cut-off while the screen is open", async () => {
    // The bakery's clock says 05:30:00; this date closes five seconds later.
    mockApi(buyerOrderingRoutes(calendarDay({ cutoffAt: "2025-12-02T05:30:05.000-06:00" })));
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-countdown-text")).toHaveTextContent(/Closes in \d s/);
    expect(screen.queryByTestId("order-closed")).toBeNull();
    await act(async () => {
      jest.advanceTimersByTime(7000);
    });
    expect(await screen.findByTestId("order-closed")).toHaveTextContent(/closed at the cut-off, Tue 2 Dec, 05:30 CST/);
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("qty-101-inc")).toBeDisabled();
  });

  it("edits an existing order with PATCH and can cancel it", async () => {
    const order = orderDto();
    const api = mockApi(
      buyerOrderingRoutes(calendarDay({ order: { id: 501, status: "open", totalCents: 5400, itemCount: 3, source: "one_off" } }), {
        "GET /api/orders/:id": { body: { order } },
        "PATCH /api/orders/:id": { body: { order: { ...order, totalCents: 9000, lines: [{ ...order.lines[0], quantity: 5, lineTotalCents: 9000 }] } } },
        "DELETE /api/orders/:id": { body: { order: { ...order, status: "cancelled" } } },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("qty-101")).toHaveDisplayValue("3");
    expect(screen.getByTestId("order-submit")).toHaveTextContent(/Save changes/);
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    fireEvent.changeText(screen.getByTestId("qty-101"), "5");
    fireEvent.press(screen.getByTestId("order-submit"));
    await waitFor(() => expect(api.callsTo("PATCH", "/api/orders/501")).toHaveLength(1));
    expect(api.callsTo("PATCH", "/api/orders/501")[0].body).toEqual({ lines: [{ productId: 101, quantity: 5 }], poNumber: "", note: "" });
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Changes saved\. Your order for Wed 3 Dec is now \$90\.00\./);

    fireEvent.press(screen.getByTestId("order-cancel"));
    fireEvent.press(screen.getByTestId("order-cancel-confirm"));
    await waitFor(() => expect(api.callsTo("DELETE", "/api/orders/501")).toHaveLength(1));
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/is cancelled/);
  });

  it("opens the existing order when the server says one is already there", async () => {
    let placed = false;
    mockApi(
      buyerOrderingRoutes(DAY, {
        "GET /api/calendar": () => ({ body: { days: [placed ? calendarDay({ order: { id: 501, status: "open", totalCents: 5400, itemCount: 3, source: "one_off" } }) : DAY] } }),
        "GET /api/orders/:id": { body: { order: orderDto() } },
        "POST /api/orders": () => {
          placed = true;
          return { status: 409, body: { error: { code: "order_exists", message: "There is already an order for this date; change that one instead.", orderId: 501 } } };
        },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "4");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/already an order for this date/);
    await waitFor(() => expect(screen.getByTestId("order-submit")).toHaveTextContent(/Save changes/));
    expect(screen.getByTestId("qty-101")).toHaveDisplayValue("3");
  });

  it("shows a locked order read-only", async () => {
    mockApi(
      buyerOrderingRoutes(calendarDay({ orderable: false, reason: "past_cutoff", reasonText: "Past the cut-off", order: { id: 501, status: "locked", totalCents: 5400, itemCount: 3, source: "standing" } }), {
        "GET /api/orders/:id": { body: { order: orderDto({ status: "locked", source: "standing" }) } },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-readonly")).toHaveTextContent(/locked for baking/);
    expect(screen.getByText("3 × Milk-bread dinner rolls")).toBeOnTheScreen();
    expect(screen.queryByTestId("order-submit")).toBeNull();
  });
});
