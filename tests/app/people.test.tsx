import { fireEvent, screen, waitFor, within } from "expo-router/testing-library";
import { OWNER, account, apiError, invitationDto, mockApi, renderApp, sessionRoutes, signedInAs, userDto, waitForGone } from "./helpers";

const USERS = [
  userDto(),
  userDto({ id: 2, email: "baker@hollowbrook.test", name: "Tomas Lindqvist", role: "baker" }),
  userDto({ id: 4, email: "buyer@tidewater.test", name: "Marisol Okafor", role: "buyer", accountId: 11, accountName: "Tidewater Café", lastSignInAt: null }),
];

describe("people", () => {
  beforeEach(() => signedInAs(OWNER));

  it("lists people, searches, and shows waiting invitations", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": (req) => ({ body: { users: USERS.filter((u) => !req.query.q || u.name.toLowerCase().includes(req.query.q.toLowerCase())) } }),
      "GET /api/invitations": { body: { invitations: [invitationDto()] } },
    });
    renderApp("/office/people");
    expect(await screen.findByTestId("user-row-4")).toHaveTextContent(/Marisol Okafor.*Tidewater Café/);
    expect(screen.getByTestId("user-row-1")).toHaveTextContent(/You/);
    expect(await screen.findByTestId("invitation-71")).toHaveTextContent(/new\.baker@hollowbrook\.test/);
    fireEvent.changeText(screen.getByLabelText("Search people"), "tomas");
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/users" && c.query.q === "tomas")).toBe(true));
    expect(await screen.findByTestId("user-row-2")).toBeOnTheScreen();
    await waitForGone("user-row-4");
    expect(api.calls.some((c) => c.path === "/api/users" && c.query.q === "tomas")).toBe(true);
  });

  it("shows the last-owner refusal clearly", async () => {
    mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": { body: { users: USERS } },
      "GET /api/invitations": { body: { invitations: [] } },
      "PATCH /api/users/:id": apiError(409, "last_owner", "This is the only active owner. Make someone else an owner first."),
    });
    renderApp("/office/people");
    fireEvent.press(await screen.findByTestId("user-1-change-role"));
    fireEvent.press(screen.getByTestId("user-1-role-baker"));
    fireEvent.press(screen.getByText("Save role"));
    expect(await screen.findByTestId("user-1-error")).toHaveTextContent(/This is the only active owner\. Make someone else an owner first\./);
  });

  it("turns a sign-in off and on again", async () => {
    let baker = USERS[1];
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": () => ({ body: { users: [USERS[0], baker, USERS[2]] } }),
      "GET /api/invitations": { body: { invitations: [] } },
      "PATCH /api/users/:id": (req) => {
        baker = { ...baker, ...(req.body as object) };
        return { body: { user: baker } };
      },
    });
    renderApp("/office/people");
    // No "Turn off" for yourself.
    await screen.findByTestId("user-row-1");
    expect(screen.queryByTestId("user-1-toggle")).toBeNull();
    fireEvent.press(screen.getByTestId("user-2-toggle"));
    expect(await screen.findByTestId("user-2-done")).toHaveTextContent(/can no longer sign in/);
    expect(api.callsTo("PATCH", "/api/users/2")[0].body).toEqual({ disabled: true });
    await waitFor(() => expect(screen.getByTestId("user-2-status")).toHaveTextContent("Turned off"));
    fireEvent.press(within(screen.getByTestId("user-row-2")).getByText("Turn on"));
    await waitFor(() => expect(api.callsTo("PATCH", "/api/users/2")[1]?.body).toEqual({ disabled: false }));
  });

  it("makes someone a buyer only with an account", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": { body: { users: USERS } },
      "GET /api/invitations": { body: { invitations: [] } },
      "GET /api/accounts": { body: { accounts: [account()] } },
      "PATCH /api/users/:id": (req) => ({ body: { user: { ...USERS[1], ...(req.body as object), accountName: "Tidewater Café" } } }),
    });
    renderApp("/office/people");
    fireEvent.press(await screen.findByTestId("user-2-change-role"));
    fireEvent.press(screen.getByTestId("user-2-role-buyer"));
    fireEvent.press(screen.getByText("Save role"));
    expect(await screen.findByText("Choose the customer account this buyer orders for.")).toBeOnTheScreen();
    expect(api.callsTo("PATCH", "/api/users/2")).toHaveLength(0);
    fireEvent.press(await screen.findByTestId("user-2-account-11"));
    fireEvent.press(screen.getByText("Save role"));
    expect(await screen.findByTestId("user-2-done")).toHaveTextContent(/now a wholesale buyer for Tidewater Café/);
    expect(api.callsTo("PATCH", "/api/users/2")[0].body).toEqual({ role: "buyer", accountId: 11 });
  });

  it("revokes an invitation after confirming", async () => {
    let invitations = [invitationDto()];
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": { body: { users: USERS } },
      "GET /api/invitations": () => ({ body: { invitations } }),
      "DELETE /api/invitations/:id": () => {
        invitations = [];
        return { status: 204 };
      },
    });
    renderApp("/office/people");
    fireEvent.press(await screen.findByTestId("invitation-71-revoke"));
    fireEvent.press(screen.getByText("Yes, revoke"));
    await waitForGone("invitation-71");
    expect(api.callsTo("DELETE", "/api/invitations/71")).toHaveLength(1);
  });

  it("sends a run-out invitation again (issue 12)", async () => {
    let invitations = [invitationDto({ expired: true, expiresAt: "2025-11-28T16:00:00.000Z" })];
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "GET /api/users": { body: { users: USERS } },
      "GET /api/invitations": () => ({ body: { invitations } }),
      "POST /api/invitations/:id/resend": () => {
        invitations = [invitationDto({ id: 72, expiresAt: "2025-12-05T16:00:00.000Z" })];
        return { status: 201, body: { invitation: invitations[0] } };
      },
    });
    renderApp("/office/people");
    expect(await screen.findByTestId("invitation-71-expired")).toHaveTextContent(/^Link ran out/);
    fireEvent.press(screen.getByTestId("invitation-71-resend"));
    await waitFor(() => expect(api.callsTo("POST", "/api/invitations/71/resend")).toHaveLength(1));
    expect(await screen.findByTestId("invitation-72")).toBeOnTheScreen();
    expect(screen.queryByTestId("invitation-72-expired")).toBeNull();
  });

  it("shows the error state when people fail to load", async () => {
    mockApi({ ...sessionRoutes(OWNER), "GET /api/users": apiError(500, "internal_error", "Something went wrong on our side. Please try again."), "GET /api/invitations": { body: { invitations: [] } } });
    renderApp("/office/people");
    expect(await screen.findByTestId("people-error")).toHaveTextContent(/Something went wrong/);
  });
});
