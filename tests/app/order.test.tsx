import { act, fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BUYER, apiError, buyerOrderingRoutes, calendarDay, mockApi, orderDto, renderApp, signedInAs } from "./helpers";
import { ApiError, api, retryAfterMs } from "../../components/api/client";
import { clearDraft, readDraft, writeDraft } from "../../components/ordering/deviceDraft";

beforeEach(() => signedInAs(BUYER));

const DAY = calendarDay();

describe("order screen for a date", () => {
  it("steps quantities within the product's bounds and keeps a running total", async () => {
    mockApi(buyerOrderingRoutes(DAY));
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-title")).toHaveTextContent("Wednesday, December 3");
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
    expect(screen.getByTestId("order-items")).toHaveTextContent("1 product");
    fireEvent.changeText(screen.getByTestId("qty-101"), "41");
    expect(screen.getByTestId("line-101-error")).toHaveTextContent("At most 40 trays of 15 rolls per order.");
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("allergen-caution")).toBeOnTheScreen();
    expect(screen.getAllByText(/Allergens shown are a guide/)).toHaveLength(1);
    expect(screen.getAllByText("May contain: Sesame").length).toBeGreaterThan(0);
  });

  it("shows how much is missing to the account's minimum and places the order with an idempotency key", async () => {
    const api = mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": { status: 201, body: { order: orderDto({ lines: [{ productId: 101, productName: "Milk-bread dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", quantity: 4, unitPriceCents: 1800, lineTotalCents: 7200, allergens: [], mayContain: "" }], totalCents: 7200 }) } },
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
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Order placed for Wednesday, December 3: Milk-bread dinner rolls \(4 trays of 15 rolls\), \$72\.00/);
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
        "POST /api/orders": apiError(400, "validation_failed", "At least 2 packs of 8 buns per order.", { "lines.1.quantity": "At least 2 packs of 8 buns per order." }),
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "3");
    fireEvent.changeText(screen.getByTestId("qty-102"), "2");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("line-102-error")).toHaveTextContent("At least 2 packs of 8 buns per order.");
    expect(screen.queryByTestId("line-101-error")).toBeNull();
    expect(screen.getByTestId("order-error-message")).toHaveTextContent(/Check Brioche burger buns/);
  });

  it("locks the form when the server says the cut-off has passed", async () => {
    mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": apiError(409, "cutoff_passed", "Orders for Wed, Dec 3 closed at the cut-off, Tue, Dec 2, 2:00 PM CST. Call the bakery if something has gone wrong."),
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "4");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-closed")).toHaveTextContent(/Orders for Wed, Dec 3 closed at the cut-off, Tue, Dec 2, 2:00 PM CST/);
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
    expect(await screen.findByTestId("order-closed")).toHaveTextContent(/closed at the cut-off, Tue, Dec 2, 5:30 AM CST/);
    expect(screen.getByTestId("order-submit")).toBeDisabled();
    expect(screen.getByTestId("qty-101-inc")).toBeDisabled();
  });

  it("after Save changes the button rests, stepping back to the first quantity is a change, and the confirmation sits by the button (issue 12, item 2)", async () => {
    let current = orderDto();
    const api = mockApi(
      buyerOrderingRoutes(calendarDay({ order: { id: 501, status: "open", totalCents: 5400, productCount: 1, source: "one_off" } }), {
        "GET /api/orders/:id": () => ({ body: { order: current } }),
        "PATCH /api/orders/:id": (req) => {
          const qty = (req.body as { lines: { quantity: number }[] }).lines[0].quantity;
          current = { ...current, totalCents: 1800 * qty, lines: [{ ...current.lines[0], quantity: qty, lineTotalCents: 1800 * qty }] };
          return { body: { order: current } };
        },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("qty-101")).toHaveDisplayValue("3");
    fireEvent.changeText(screen.getByTestId("qty-101"), "5");
    fireEvent.press(screen.getByTestId("order-submit"));
    await waitFor(() => expect(api.callsTo("PATCH", "/api/orders/501")).toHaveLength(1));
    expect(await screen.findByTestId("order-saved-here")).toHaveTextContent(/Changes saved\. Your order for Wed, Dec 3 is now \$90\.00\./);
    // Saved: nothing to save until something changes.
    await waitFor(() => expect(screen.getByTestId("order-submit")).toBeDisabled());
    // Back to the quantity the page opened with: that is a change from the saved order, and it can be saved.
    fireEvent.changeText(screen.getByTestId("qty-101"), "3");
    expect(screen.getByTestId("order-submit")).toBeEnabled();
    expect(screen.queryByTestId("order-saved-here")).toBeNull();
    fireEvent.press(screen.getByTestId("order-submit"));
    await waitFor(() => expect(api.callsTo("PATCH", "/api/orders/501")).toHaveLength(2));
    expect(api.callsTo("PATCH", "/api/orders/501")[1].body).toMatchObject({ lines: [{ productId: 101, quantity: 3 }] });
    expect(await screen.findByTestId("order-saved-here")).toHaveTextContent(/\$54\.00/);
  });

  it("edits an existing order with PATCH and can cancel it", async () => {
    const order = orderDto();
    const api = mockApi(
      buyerOrderingRoutes(calendarDay({ order: { id: 501, status: "open", totalCents: 5400, productCount: 1, source: "one_off" } }), {
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
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Changes saved\. Your order for Wed, Dec 3 is now \$90\.00\./);

    fireEvent.press(screen.getByTestId("order-cancel"));
    fireEvent.press(screen.getByTestId("order-cancel-confirm"));
    await waitFor(() => expect(api.callsTo("DELETE", "/api/orders/501")).toHaveLength(1));
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/is canceled/);
  });

  it("opens the existing order when the server says one is already there", async () => {
    let placed = false;
    mockApi(
      buyerOrderingRoutes(DAY, {
        "GET /api/calendar": () => ({ body: { days: [placed ? calendarDay({ order: { id: 501, status: "open", totalCents: 5400, productCount: 1, source: "one_off" } }) : DAY] } }),
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
      buyerOrderingRoutes(calendarDay({ orderable: false, reason: "past_cutoff", reasonText: "Past the cut-off", order: { id: 501, status: "locked", totalCents: 5400, productCount: 1, source: "standing" } }), {
        "GET /api/orders/:id": { body: { order: orderDto({ status: "locked", source: "standing" }) } },
      }),
    );
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-readonly")).toHaveTextContent(/locked for baking/);
    expect(screen.getByText("3 trays of 15 rolls · $18.00 per tray of 15 rolls")).toBeOnTheScreen();
    expect(screen.queryByTestId("order-submit")).toBeNull();
    // "Call the bakery" comes with the number, a tel: link (issue 12, contact).
    expect(screen.getByTestId("call-bakery")).toHaveTextContent(/Call .*:\+1 555 0100/);
    expect(screen.getByTestId("call-bakery-phone-link")).toBeOnTheScreen();
  });
});

// ---- Panwise briefly unavailable (its database restarting): GETs retried, the order kept on the device ----

const UNAVAILABLE = "Ordering is briefly unavailable; nothing was saved; try again in a moment.";
const OWNER_KEY = { userId: BUYER.id, accountId: BUYER.accountId! };

/** Give mockApi's answers a Retry-After header on 503s (its fake Response has no headers of its own). */
function withRetryAfter(seconds: string) {
  const inner = globalThis.fetch as unknown as (...a: unknown[]) => Promise<{ status: number }>;
  (globalThis as { fetch?: unknown }).fetch = jest.fn(async (...args: unknown[]) => {
    const res = await inner(...args);
    return { ...res, headers: { get: (name: string) => (res.status === 503 && name.toLowerCase() === "retry-after" ? seconds : null) } };
  });
}

describe("when Panwise is briefly unavailable", () => {
  beforeEach(() => clearDraft(OWNER_KEY, "2025-12-03"));

  it("keeps the order on the device when saving answers 503, puts it back on return, and clears it once placed", async () => {
    let down = true;
    const api = mockApi(
      buyerOrderingRoutes(DAY, {
        "POST /api/orders": () => (down ? apiError(503, "service_unavailable", UNAVAILABLE) : { status: 201, body: { order: orderDto({ lines: [], totalCents: 9000 }) } }),
      }),
    );
    withRetryAfter("5");
    const first = renderApp("/buyer/order/2025-12-03");
    fireEvent.changeText(await screen.findByTestId("qty-101"), "5");
    fireEvent.changeText(screen.getByTestId("order-po"), "PO-9");
    fireEvent.press(screen.getByTestId("order-submit"));
    // The server's own words, and the order kept; an order is never sent again on its own.
    expect(await screen.findByTestId("order-error-message")).toHaveTextContent(/Ordering is briefly unavailable; nothing was saved; try again in a moment\. Your order is kept on this device: press the button again to send it\.$/);
    expect(api.callsTo("POST", "/api/orders")).toHaveLength(1);
    expect(readDraft(OWNER_KEY, "2025-12-03")).toMatchObject({ quantities: { 101: "5" }, poNumber: "PO-9", orderId: null });

    // The buyer leaves and comes back: the order is filled in again.
    first.unmount();
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-draft-restored")).toHaveTextContent(/didn't reach the bakery; it was kept on this device.*Place order/);
    expect(screen.getByTestId("qty-101")).toHaveDisplayValue("5");
    expect(screen.getByTestId("order-po")).toHaveDisplayValue("PO-9");
    expect(screen.getByTestId("order-total")).toHaveTextContent("$90.00");

    down = false;
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Order placed/);
    expect(api.callsTo("POST", "/api/orders")).toHaveLength(2);
    expect(api.callsTo("POST", "/api/orders")[1].body).toEqual({ deliveryDate: "2025-12-03", lines: [{ productId: 101, quantity: 5 }], poNumber: "PO-9" });
    expect(readDraft(OWNER_KEY, "2025-12-03")).toBeNull();
  });

  it("keeps changes to an existing order through a dropped connection, and drops the draft when the bakery already has it", async () => {
    const order = orderDto();
    let saved = order;
    let online = false;
    mockApi(
      buyerOrderingRoutes(calendarDay({ order: { id: 501, status: "open", totalCents: 5400, productCount: 1, source: "one_off" } }), {
        "GET /api/orders/:id": () => ({ body: { order: saved } }),
        "PATCH /api/orders/:id": () => {
          if (!online) throw new TypeError("Network request failed");
          saved = { ...order, totalCents: 12600, lines: [{ ...order.lines[0], quantity: 7, lineTotalCents: 12600 }] };
          return { body: { order: saved } };
        },
      }),
    );
    const first = renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("qty-101")).toHaveDisplayValue("3");
    fireEvent.changeText(screen.getByTestId("qty-101"), "7");
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-error-message")).toHaveTextContent(/can't be reached.*kept on this device/);
    expect(readDraft(OWNER_KEY, "2025-12-03")).toMatchObject({ quantities: { 101: "7" }, orderId: 501 });
    first.unmount();

    // Back on the screen: the bakery still has 3; the kept 7 is filled in and can be saved.
    const second = renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("order-draft-restored")).toHaveTextContent(/Save changes/);
    expect(screen.getByTestId("qty-101")).toHaveDisplayValue("7");
    online = true;
    fireEvent.press(screen.getByTestId("order-submit"));
    expect(await screen.findByTestId("order-notice")).toHaveTextContent(/Changes saved/);
    expect(readDraft(OWNER_KEY, "2025-12-03")).toBeNull();
    second.unmount();

    // A draft saying what the bakery already has (the change did get through) is dropped, not shown.
    writeDraft(OWNER_KEY, "2025-12-03", { quantities: { 101: "7" }, poNumber: "", note: "", orderId: 501 });
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("qty-101")).toHaveDisplayValue("7");
    expect(screen.queryByTestId("order-draft-restored")).toBeNull();
    expect(readDraft(OWNER_KEY, "2025-12-03")).toBeNull();
  });

  it("loads the date after a 503 with Retry-After by asking again", async () => {
    let calendarCalls = 0;
    const api = mockApi(
      buyerOrderingRoutes(DAY, {
        "GET /api/calendar": () => (++calendarCalls === 1 ? apiError(503, "service_unavailable", "Panwise is briefly unavailable; try again in a moment.") : { body: { days: [DAY] } }),
      }),
    );
    withRetryAfter("1");
    renderApp("/buyer/order/2025-12-03");
    expect(await screen.findByTestId("qty-101", {}, { timeout: 5000 })).toBeOnTheScreen();
    expect(api.callsTo("GET", "/api/calendar")).toHaveLength(2);
    expect(screen.queryByTestId("order-error")).toBeNull();
  });
});

describe("api client retries", () => {
  afterEach(() => jest.useRealTimers());

  it("sends a GET again after network failures, with backoff, and gives up after three retries", async () => {
    jest.useFakeTimers();
    let calls = 0;
    (globalThis as { fetch?: unknown }).fetch = jest.fn(async () => {
      calls++;
      if (calls < 3) throw new TypeError("Failed to fetch");
      return { ok: true, status: 200, text: async () => JSON.stringify({ ok: 1 }) };
    });
    const got = api("/api/bakery");
    await jest.advanceTimersByTimeAsync(499);
    expect(calls).toBe(1);
    await jest.advanceTimersByTimeAsync(1);
    expect(calls).toBe(2);
    await jest.advanceTimersByTimeAsync(1000);
    await expect(got).resolves.toEqual({ ok: 1 });
    expect(calls).toBe(3);

    calls = -100;
    const lost = api("/api/bakery").catch((e: unknown) => e);
    await jest.advanceTimersByTimeAsync(500 + 1000 + 2000);
    const err = await lost;
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 0, code: "network_error" });
    expect(calls).toBe(-96); // the first try and three retries
  });

  it("waits as long as Retry-After asks, shows the server's message when it stays unavailable, and never retries a POST", async () => {
    jest.useFakeTimers();
    const calls: string[] = [];
    (globalThis as { fetch?: unknown }).fetch = jest.fn(async (_url: string, init: { method?: string } = {}) => {
      calls.push(init.method ?? "GET");
      const text = JSON.stringify({ error: { code: "service_unavailable", message: "Panwise is briefly unavailable; try again in a moment." } });
      return { ok: false, status: 503, headers: { get: (n: string) => (n === "Retry-After" ? "3" : null) }, text: async () => text };
    });
    const got = api("/api/orders").catch((e: unknown) => e);
    await jest.advanceTimersByTimeAsync(2999);
    expect(calls).toHaveLength(1);
    await jest.advanceTimersByTimeAsync(1);
    expect(calls).toHaveLength(2);
    await jest.advanceTimersByTimeAsync(3000 * 2);
    expect(await got).toMatchObject({ status: 503, code: "service_unavailable", message: "Panwise is briefly unavailable; try again in a moment." });
    expect(calls).toHaveLength(4);

    calls.length = 0;
    const posted = await api("/api/orders", { method: "POST", body: {} }).catch((e: unknown) => e);
    expect(posted).toMatchObject({ status: 503, code: "service_unavailable" });
    expect(calls).toEqual(["POST"]);
  });

  it("reads Retry-After as seconds or an HTTP-date (RFC 9110 §10.2.3)", () => {
    expect(retryAfterMs("5")).toBe(5000);
    expect(retryAfterMs("Wed, 21 Oct 2015 07:28:10 GMT", Date.parse("2015-10-21T07:28:00Z"))).toBe(10_000);
    expect(retryAfterMs(null)).toBeNull();
    expect(retryAfterMs("soon")).toBeNull();
  });
});
