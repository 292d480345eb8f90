import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKER, BOOKKEEPER, BUYER, OWNER, SUMMARY, account, apiError, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { readSession } from "../../components/auth/storage";

const officeRoutes = { "GET /api/office/summary": { body: { summary: SUMMARY } } };

describe("who goes where", () => {
  it("sends a signed-out visitor from / to /sign-in", async () => {
    mockApi({});
    const app = renderApp("/");
    expect(await screen.findByLabelText("E-mail")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/sign-in");
  });

  it("sends a signed-out visitor from an office page to /sign-in", async () => {
    mockApi({});
    const app = renderApp("/office/accounts");
    expect(await screen.findByText("Sign in")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/sign-in");
  });

  it.each([
    [OWNER, "/office", "office-home-title"],
    [BOOKKEEPER, "/office", "office-home-title"],
    [BAKER, "/bake", "baker-home-title"],
    [BUYER, "/buyer", "buyer-home-title"],
  ])("sends %p from / to their home", async (user, path, titleId) => {
    signedInAs(user);
    mockApi({ ...sessionRoutes(user), ...officeRoutes, "GET /api/accounts/:id": { body: { account: account() } } });
    const app = renderApp("/");
    expect(await screen.findByTestId(titleId)).toBeOnTheScreen();
    expect(app.getPathname()).toBe(path);
  });

  it("sends a buyer who opens an office page to the buyer home", async () => {
    signedInAs(BUYER);
    mockApi({ ...sessionRoutes(BUYER), "GET /api/accounts/:id": { body: { account: account() } } });
    const app = renderApp("/office/people");
    expect(await screen.findByTestId("buyer-home-title")).toHaveTextContent(/Tidewater Café/);
    expect(app.getPathname()).toBe("/buyer");
    // Issue 12, item 4: a redirect for a role says why.
    expect(await screen.findByTestId("redirect-notice")).toHaveTextContent(/That page is for the bakery's staff\. You're signed in as a wholesale buyer, so you're on your own home page instead\./);
  });

  it("sends a baker who opens the buyer area to the bake day", async () => {
    signedInAs(BAKER);
    mockApi(sessionRoutes(BAKER));
    const app = renderApp("/buyer/account");
    expect(await screen.findByTestId("baker-home-title")).toHaveTextContent(/Bake day/);
    expect(app.getPathname()).toBe("/bake");
  });

  it("keeps the bookkeeper out of People (owner only) and hides it from the navigation", async () => {
    signedInAs(BOOKKEEPER);
    const api = mockApi({ ...sessionRoutes(BOOKKEEPER), ...officeRoutes });
    const app = renderApp("/office/people");
    expect(await screen.findByTestId("office-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/office");
    expect(await screen.findByTestId("redirect-notice")).toHaveTextContent(/That page is for the owner\. You're signed in as a bookkeeper, so you're on your own home page instead\./);
    fireEvent.press(screen.getByTestId("redirect-notice-dismiss"));
    await waitFor(() => expect(screen.queryByTestId("redirect-notice")).toBeNull());
    expect(screen.getByTestId("tab-accounts")).toBeOnTheScreen();
    expect(screen.queryByTestId("tab-people")).toBeNull();
    expect(screen.queryByTestId("office-people-card")).toBeNull();
    expect(api.callsTo("GET", "/api/users")).toHaveLength(0);
  });

  it("keeps the bookkeeper away from account editing", async () => {
    signedInAs(BOOKKEEPER);
    mockApi({ ...sessionRoutes(BOOKKEEPER), ...officeRoutes });
    const app = renderApp("/office/accounts/new");
    expect(await screen.findByTestId("office-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/office");
  });

  it("sends a signed-in person away from /sign-in to their home", async () => {
    signedInAs(BAKER);
    mockApi(sessionRoutes(BAKER));
    const app = renderApp("/sign-in");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/bake");
  });

  it("signs out when the stored token is no longer accepted", async () => {
    signedInAs(OWNER);
    mockApi({ "GET /api/auth/me": apiError(401, "unauthorized", "Your session has expired. Sign in again.") });
    const app = renderApp("/office");
    expect(await screen.findByLabelText("E-mail")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/sign-in");
    expect(readSession()).toBeNull();
  });

  it("picks up a changed role from the server at start-up", async () => {
    signedInAs({ ...OWNER, role: "owner" });
    mockApi({ ...sessionRoutes({ ...OWNER, role: "baker" }) });
    const app = renderApp("/office");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/bake");
  });

  it("signs out on a 401 from any later call and forgets the cached data", async () => {
    signedInAs(OWNER);
    let expired = false;
    mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/office/summary": { body: { summary: SUMMARY } },
      "GET /api/accounts": () => (expired ? apiError(401, "unauthorized", "Your session has expired. Sign in again.") : { body: { accounts: [] } }),
    });
    const app = renderApp("/office");
    expect(await screen.findByTestId("office-home-title")).toBeOnTheScreen();
    expired = true;
    fireEvent.press(screen.getByTestId("tab-accounts"));
    expect(await screen.findByText("Your session ended. Please sign in again.")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/sign-in");
    expect(readSession()).toBeNull();
    expect(app.queryClient.getQueryCache().getAll()).toHaveLength(0);
  });

  it("Sign out clears the session and the query cache", async () => {
    signedInAs(BAKER);
    mockApi(sessionRoutes(BAKER));
    const app = renderApp("/bake");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    expect(app.queryClient.getQueryCache().getAll().length).toBeGreaterThan(0);
    fireEvent.press(screen.getByTestId("sign-out"));
    await waitFor(() => expect(app.getPathname()).toBe("/sign-in"));
    expect(readSession()).toBeNull();
    expect(app.queryClient.getQueryCache().getAll()).toHaveLength(0);
    expect(screen.queryByText("Your session ended. Please sign in again.")).toBeNull();
  });
});
