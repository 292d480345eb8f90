import { Dimensions } from "react-native";
import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BOOKKEEPER, OWNER, account, apiError, mockApi, renderApp, sessionRoutes, signedInAs, waitForGone } from "./helpers";

const ACCOUNTS = [
  account(),
  account({ id: 12, businessName: "Juniper Table", status: "on_hold", contactName: "Declan Reyes", buyerCount: 2 }),
  account({ id: 13, businessName: "North Pier Kiosk", status: "closed", buyerCount: 0 }),
  account({ id: 14, businessName: "Lantern Deli", status: "on_hold", creditHold: true, buyerCount: 1 }),
];

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}

afterEach(() => Dimensions.set({ window: original, screen: original }));

describe("accounts list", () => {
  it("renders a row per account with its status", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts": { body: { accounts: ACCOUNTS } } });
    renderApp("/office/accounts");
    expect(await screen.findByTestId("account-row-11")).toHaveTextContent(/Tidewater Café/);
    // A pause by hand reads "Paused"; the automatic hold for overdue invoices reads "Credit hold" (issue 10).
    expect(screen.getByTestId("account-row-12")).toHaveTextContent(/Juniper Table.*Paused/);
    expect(screen.getByTestId("account-row-14")).toHaveTextContent(/Lantern Deli.*Credit hold/);
    expect(screen.getByTestId("account-row-14")).not.toHaveTextContent(/Paused/);
    expect(screen.getByTestId("account-row-13")).toHaveTextContent(/Closed/);
    expect(screen.getByTestId("accounts-count")).toHaveTextContent("4 accounts");
    expect(screen.getByText("New account")).toBeOnTheScreen();
  });

  it("shows a table from 1024 px", async () => {
    setWidth(1280);
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts": { body: { accounts: ACCOUNTS } } });
    renderApp("/office/accounts");
    expect(await screen.findByTestId("accounts-table")).toBeOnTheScreen();
    expect(screen.getByText("Billing e-mail")).toBeOnTheScreen();
    expect(screen.getByTestId("app-shell-wide")).toBeOnTheScreen();
    expect(screen.getByTestId("nav-people")).toBeOnTheScreen();
  });

  it("sends the search and the status filter to the API", async () => {
    signedInAs(OWNER);
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts": (req) => ({ body: { accounts: ACCOUNTS.filter((a) => (!req.query.status || a.status === req.query.status) && (!req.query.q || a.businessName.toLowerCase().includes(req.query.q.toLowerCase()))) } }),
    });
    renderApp("/office/accounts");
    await screen.findByTestId("account-row-11");
    fireEvent.press(screen.getByTestId("accounts-status-on_hold"));
    expect(await screen.findByTestId("account-row-12")).toBeOnTheScreen();
    expect(screen.queryByTestId("account-row-11")).toBeNull();
    expect(api.calls.some((c) => c.path === "/api/accounts" && c.query.status === "on_hold")).toBe(true);

    fireEvent.press(screen.getByTestId("accounts-status-all"));
    fireEvent.changeText(screen.getByLabelText("Search accounts"), "pier");
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/accounts" && c.query.q === "pier")).toBe(true));
    expect(await screen.findByTestId("account-row-13")).toBeOnTheScreen();
    await waitForGone("account-row-12");
    expect(api.calls.some((c) => c.path === "/api/accounts" && c.query.q === "pier")).toBe(true);
  });

  it("shows the empty state", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts": { body: { accounts: [] } } });
    renderApp("/office/accounts");
    expect(await screen.findByTestId("accounts-empty")).toHaveTextContent(/No customer accounts yet/);
  });

  it("shows the error state and retries", async () => {
    signedInAs(OWNER);
    let fail = true;
    mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts": () => (fail ? apiError(500, "internal_error", "Something went wrong on our side. Please try again.") : { body: { accounts: ACCOUNTS } }),
    });
    renderApp("/office/accounts");
    expect(await screen.findByTestId("accounts-error")).toHaveTextContent(/Something went wrong on our side/);
    fail = false;
    fireEvent.press(screen.getByText("Try again"));
    expect(await screen.findByTestId("account-row-11")).toBeOnTheScreen();
  });

  it("lets the bookkeeper look but not add or edit", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), "GET /api/accounts": { body: { accounts: ACCOUNTS } }, "GET /api/accounts/:id": { body: { account: ACCOUNTS[0] } } });
    renderApp("/office/accounts");
    fireEvent.press(await screen.findByTestId("account-row-11"));
    expect(await screen.findByTestId("account-title")).toHaveTextContent("Tidewater Café");
    expect(screen.queryByText("New account")).toBeNull();
    expect(screen.queryByTestId("edit-account")).toBeNull();
    expect(screen.queryByTestId("account-status-card")).toBeNull();
  });
});

describe("account detail and form", () => {
  beforeEach(() => signedInAs(OWNER));

  it("closes an account only after the confirm step", async () => {
    let current = account();
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts/:id": () => ({ body: { account: current } }),
      "PATCH /api/accounts/:id": (req) => {
        current = { ...current, ...(req.body as object) };
        return { body: { account: current } };
      },
    });
    renderApp("/office/accounts/11");
    fireEvent.press(await screen.findByTestId("close-account"));
    expect(screen.getByTestId("close-confirm")).toHaveTextContent(/Close Tidewater Café\?/);
    expect(api.callsTo("PATCH", "/api/accounts/11")).toHaveLength(0);
    fireEvent.press(screen.getByText("Yes, close account"));
    expect(await screen.findByTestId("account-status-done")).toHaveTextContent(/now closed/);
    expect(api.callsTo("PATCH", "/api/accounts/11")[0].body).toEqual({ status: "closed" });
    expect(await screen.findByTestId("reopen-account")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("reopen-account"));
    expect(await screen.findByTestId("hold-account")).toBeOnTheScreen();
    expect(api.callsTo("PATCH", "/api/accounts/11")[1].body).toEqual({ status: "active" });
  });

  it("tells a credit hold (automatic) from a pause (by hand) (issue 12, item 3)", async () => {
    let current = account({ status: "on_hold", creditHold: true });
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts/:id": () => ({ body: { account: current } }) });
    renderApp("/office/accounts/11");
    expect(await screen.findByTestId("account-status-help")).toHaveTextContent(/^Credit hold \(automatic\): invoices overdue longer than the billing settings allow put the account on hold/);
    expect(screen.getByTestId("account-status")).toHaveTextContent("Credit hold");
    expect(screen.getByTestId("activate-account")).toHaveTextContent(/Lift credit hold/);
    screen.unmount();
    current = account({ status: "on_hold", creditHold: false });
    renderApp("/office/accounts/11");
    expect(await screen.findByTestId("account-status-help")).toHaveTextContent(/^Paused \(by hand\): the bakery has paused this account's orders\./);
    expect(screen.getByTestId("account-status")).toHaveTextContent("Paused");
    expect(screen.getByTestId("activate-account")).toHaveTextContent(/Make active/);
  });

  it("lists the account's buyers by name (issue 12)", async () => {
    mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts/:id": { body: { account: account({ buyerCount: 1 }) } },
      "GET /api/accounts/:id/buyers": { body: { buyers: [{ id: 5, name: "Marisol Okafor", email: "buyer@tidewater.test", disabled: false, lastSignInAt: null }, { id: 6, name: "Old Hand", email: "old@tidewater.test", disabled: true, lastSignInAt: null }] } },
    });
    renderApp("/office/accounts/11");
    expect(await screen.findByTestId("account-buyer-5")).toHaveTextContent(/Marisol Okafor.*buyer@tidewater\.test/);
    expect(screen.getByTestId("account-buyer-6")).toHaveTextContent(/Old Hand \(sign-in turned off\)/);
  });

  it("says so when the account does not exist", async () => {
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts/:id": apiError(404, "not_found", "That account was not found.") });
    renderApp("/office/accounts/999");
    expect(await screen.findByTestId("account-not-found")).toBeOnTheScreen();
  });

  it("checks the new-account form with the shared schema and shows server field errors", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "POST /api/accounts": apiError(400, "validation_failed", "Enter a valid e-mail address, like name@example.com.", { billingEmail: "Enter a valid e-mail address, like name@example.com." }),
    });
    renderApp("/office/accounts/new");
    fireEvent.press(await screen.findByText("Add account"));
    expect(await screen.findByText("Enter the business name.")).toBeOnTheScreen();
    expect(screen.getByText("Enter the delivery address.")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/accounts")).toHaveLength(0);

    fireEvent.changeText(screen.getByLabelText("Business name"), "Harbor Light Café");
    fireEvent.changeText(screen.getByLabelText("Delivery address"), "1 Quay St");
    fireEvent.changeText(screen.getByLabelText("Billing e-mail"), "bills@harborlight.test");
    fireEvent.press(screen.getByText("Add account"));
    expect(await screen.findByTestId("account-billingEmail-error")).toHaveTextContent(/valid e-mail/);
    expect(api.callsTo("POST", "/api/accounts")[0].body).toMatchObject({ businessName: "Harbor Light Café", deliveryAddress: "1 Quay St", billingEmail: "bills@harborlight.test", status: "active" });
  });

  it("creates an account and opens it", async () => {
    const created = account({ id: 20, businessName: "Harbor Light Café", deliveryAddress: "1 Quay St", billingEmail: "bills@harborlight.test", buyerCount: 0 });
    mockApi({ ...sessionRoutes(OWNER), "POST /api/accounts": { status: 201, body: { account: created } }, "GET /api/accounts/:id": { body: { account: created } } });
    const app = renderApp("/office/accounts/new");
    fireEvent.changeText(await screen.findByLabelText("Business name"), "Harbor Light Café");
    fireEvent.changeText(screen.getByLabelText("Delivery address"), "1 Quay St");
    fireEvent.changeText(screen.getByLabelText("Billing e-mail"), "bills@harborlight.test");
    fireEvent.press(screen.getByText("Add account"));
    expect(await screen.findByTestId("account-title")).toHaveTextContent("Harbor Light Café");
    expect(app.getPathname()).toBe("/office/accounts/20");
  });

  it("edits an account without touching its status", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/accounts/:id": { body: { account: account() } },
      "PATCH /api/accounts/:id": (req) => ({ body: { account: { ...account(), ...(req.body as object) } } }),
    });
    const app = renderApp("/office/accounts/11/edit");
    const name = await screen.findByLabelText("Business name");
    expect(name).toHaveDisplayValue("Tidewater Café");
    fireEvent.changeText(name, "Tidewater Café Co.");
    fireEvent.press(screen.getByText("Save changes"));
    await waitFor(() => expect(app.getPathname()).toBe("/office/accounts/11"));
    const body = api.callsTo("PATCH", "/api/accounts/11")[0].body as Record<string, unknown>;
    expect(body.businessName).toBe("Tidewater Café Co.");
    expect(body).not.toHaveProperty("status");
  });
});
