import { act, fireEvent, screen } from "expo-router/testing-library";
import { BUYER, OWNER, account, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { PAID_DETAIL, invoiceDetail } from "./billing-fixtures";

const OPEN = invoiceDetail();

async function tick(ms: number) {
  await act(async () => {
    jest.advanceTimersByTime(ms);
  });
}

describe("payment return page", () => {
  it("says the payment is processing, polls every 1.5 s and shows Paid with a receipt", async () => {
    signedInAs(BUYER);
    let reads = 0;
    const api = mockApi({ ...sessionRoutes(BUYER), "GET /api/invoices/:id": () => ({ body: ++reads < 3 ? OPEN : PAID_DETAIL }) });
    renderApp("/pay/return?invoice=41&session_id=cs_test_1");
    expect(await screen.findByTestId("pay-processing")).toHaveTextContent("Payment processing — this takes a few seconds");
    expect(screen.getByTestId("pay-title")).toHaveTextContent("HB-2025-00041");
    await tick(1500);
    expect(screen.getByTestId("pay-processing")).toBeOnTheScreen();
    await tick(1500);
    expect(await screen.findByTestId("pay-paid")).toHaveTextContent("Paid");
    expect(screen.getByTestId("pay-receipt-amount")).toHaveTextContent("$58.73");
    expect(screen.getByTestId("pay-receipt-date")).toHaveTextContent("Dec 2, 2025");
    expect(screen.getByTestId("pay-receipt-method")).toHaveTextContent("Card");
    expect(screen.getByTestId("pay-back-invoices")).toBeOnTheScreen();
    expect(api.callsTo("GET", "/api/invoices/41")).toHaveLength(3);
    // Paid: no more polling.
    await tick(6000);
    expect(api.callsTo("GET", "/api/invoices/41")).toHaveLength(3);
  });

  it("after a late invoice is paid, says whether ordering is open again (issue 12, item 3)", async () => {
    signedInAs(BUYER);
    let held = true;
    mockApi({
      ...sessionRoutes(BUYER),
      "GET /api/invoices/:id": { body: PAID_DETAIL },
      "GET /api/accounts/:id": () => ({ body: { account: account(held ? { status: "on_hold", creditHold: true } : {}) } }),
    });
    renderApp("/pay/return?invoice=41&session_id=cs_test_1");
    expect(await screen.findByTestId("pay-paid")).toBeOnTheScreen();
    expect(await screen.findByTestId("pay-still-held")).toHaveTextContent(/^Your account is still on credit hold: other invoices are overdue\./);
    screen.unmount();
    held = false;
    renderApp("/pay/return?invoice=41&session_id=cs_test_1");
    expect(await screen.findByTestId("pay-ordering-open")).toHaveTextContent(/Ordering is open again: nothing is overdue on your account\./);
  });

  it("stops waiting after a minute with a calm message, and can check again", async () => {
    signedInAs(BUYER);
    let confirmed = false;
    const api = mockApi({ ...sessionRoutes(BUYER), "GET /api/invoices/:id": () => ({ body: confirmed ? PAID_DETAIL : OPEN }) });
    renderApp("/pay/return?invoice=41&session_id=cs_test_1");
    await screen.findByTestId("pay-processing");
    for (let i = 0; i < 40; i++) await tick(1500);
    expect(await screen.findByTestId("pay-timeout")).toHaveTextContent("We haven't heard from the card processor yet; the invoice will update when they confirm.");
    const asked = api.callsTo("GET", "/api/invoices/41").length;
    expect(asked).toBeGreaterThan(30);
    await tick(10_000);
    expect(api.callsTo("GET", "/api/invoices/41")).toHaveLength(asked);
    confirmed = true;
    fireEvent.press(screen.getByTestId("pay-check-again"));
    expect(await screen.findByTestId("pay-paid")).toBeOnTheScreen();
  });

  it("says a cancelled payment was cancelled and offers to try again", async () => {
    signedInAs(BUYER);
    const api = mockApi({ ...sessionRoutes(BUYER), "GET /api/invoices/:id": { body: OPEN }, "POST /api/invoices/:id/checkout": { status: 201, body: { url: "http://127.0.0.1:12111/pay/cs_test_2" } } });
    renderApp("/pay/return?invoice=41&cancelled=1");
    expect(await screen.findByTestId("pay-cancelled")).toHaveTextContent("The payment was canceled");
    expect(screen.queryByTestId("pay-processing")).toBeNull();
    await tick(5000);
    expect(api.callsTo("GET", "/api/invoices/41")).toHaveLength(1);
    fireEvent.press(screen.getByTestId("pay-retry"));
    expect(await screen.findByTestId("pay-retry-opening")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/invoices/41/checkout")).toHaveLength(1);
  });

  it("asks a signed-out visitor to sign in, then carries on with the invoice", async () => {
    mockApi({
      "POST /api/auth/sign-in": { body: { token: "t-1", user: OWNER } },
      ...sessionRoutes(OWNER),
      "GET /api/invoices/:id": { body: PAID_DETAIL },
    });
    const app = renderApp("/pay/return?invoice=41&session_id=cs_test_1");
    fireEvent.changeText(await screen.findByTestId("sign-in-email"), "owner@hollowbrook.test");
    fireEvent.changeText(screen.getByTestId("sign-in-password"), "panwise-demo-pass");
    fireEvent.press(screen.getByTestId("sign-in-submit"));
    expect(await screen.findByTestId("pay-paid")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/pay/return");
    expect(screen.getByTestId("tab-invoices")).toBeOnTheScreen();
  });
});
