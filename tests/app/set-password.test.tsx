import { fireEvent, screen } from "expo-router/testing-library";
import { BUYER, account, apiError, mockApi, renderApp, sessionRoutes, waitForLabelGone } from "./helpers";
import { readSession } from "../../components/auth/storage";
import { PASSWORD_COMMON, PASSWORD_PATTERN } from "../../shared/schemas/common";
import type { InvitationPreview } from "../../components/api/auth";

const TOKEN = "tok_abcdefghijklmnop";

describe("set-password: reset", () => {
  it("says the rules up front, and asks for 12 characters, no repeated runs and a matching confirmation before calling the API", async () => {
    const api = mockApi({});
    renderApp(`/set-password?kind=reset&token=${TOKEN}`);
    expect(
      await screen.findByText("12 to 128 characters; spaces in a row count once. A few unrelated words work well; common passwords are refused."),
    ).toBeOnTheScreen();
    fireEvent.changeText(screen.getByLabelText("New password"), "1234567890");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "1234567890");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByText("Use at least 12 characters.")).toBeOnTheScreen();

    fireEvent.changeText(screen.getByLabelText("New password"), "aaaaaaaaaaaa");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "aaaaaaaaaaaa");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByText(PASSWORD_PATTERN)).toBeOnTheScreen();

    fireEvent.changeText(screen.getByLabelText("New password"), "long enough password");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "long enough passwort");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByText("The two passwords don't match.")).toBeOnTheScreen();
    expect(screen.queryByText("Use at least 12 characters.")).toBeNull();
    expect(api.calls).toHaveLength(0);
  });

  it("shows the server's refusal of a common password on the password field", async () => {
    const api = mockApi({
      "POST /api/auth/password-reset/confirm": apiError(400, "validation_failed", PASSWORD_COMMON, { password: PASSWORD_COMMON }),
    });
    renderApp(`/set-password?kind=reset&token=${TOKEN}`);
    fireEvent.changeText(await screen.findByLabelText("New password"), "password1234");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "password1234");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByText(PASSWORD_COMMON)).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/auth/password-reset/confirm")).toHaveLength(1);
    expect(readSession()).toBeNull();
  });

  it("shows a used link's error at the top", async () => {
    mockApi({
      "POST /api/auth/password-reset/confirm": apiError(400, "token_used", "This reset link has already been used. Sign in, or ask for a new one.", { token: "Already used." }),
    });
    renderApp(`/set-password?kind=reset&token=${TOKEN}`);
    fireEvent.changeText(await screen.findByLabelText("New password"), "a brand new password");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "a brand new password");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByTestId("set-password-error")).toHaveTextContent(/already been used/);
  });

  it("saves the password, signs in and goes home", async () => {
    const api = mockApi({
      ...sessionRoutes(BUYER),
      "POST /api/auth/password-reset/confirm": { body: { token: "tok-buyer", user: BUYER } },
      "GET /api/accounts/:id": { body: { account: account() } },
    });
    const app = renderApp(`/set-password?kind=reset&token=${TOKEN}`);
    fireEvent.changeText(await screen.findByLabelText("New password"), "a brand new password");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "a brand new password");
    fireEvent.press(screen.getByText("Save new password"));
    expect(await screen.findByTestId("buyer-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/buyer");
    expect(api.callsTo("POST", "/api/auth/password-reset/confirm")[0].body).toEqual({ token: TOKEN, password: "a brand new password" });
    expect(readSession()?.token).toBe("tok-buyer");
  });

  it("explains a link without its token", async () => {
    mockApi({});
    renderApp("/set-password?kind=reset");
    expect(await screen.findByTestId("set-password-link-error")).toHaveTextContent(/missing its code/);
  });
});

describe("set-password: invitation", () => {
  it("shows who the invitation is for, then creates the sign-in", async () => {
    const api = mockApi({
      ...sessionRoutes(BUYER),
      [`GET /api/auth/invitations/${TOKEN}`]: { body: { email: "buyer@tidewater.test", role: "buyer", name: "Marisol" } satisfies InvitationPreview },
      "POST /api/auth/invitations/accept": { body: { token: "tok-new", user: BUYER } },
      "GET /api/accounts/:id": { body: { account: account() } },
    });
    const app = renderApp(`/set-password?kind=invite&token=${TOKEN}&email=buyer%40tidewater.test`);
    expect(await screen.findByTestId("invitation-for")).toHaveTextContent(/buyer@tidewater\.test/);
    expect(screen.getByTestId("invitation-for")).toHaveTextContent(/Wholesale buyer/);
    expect(screen.getByLabelText("Your name")).toHaveDisplayValue("Marisol");

    fireEvent.changeText(screen.getByLabelText("Your name"), "Marisol Okafor");
    fireEvent.changeText(screen.getByLabelText("New password"), "1234");
    fireEvent.press(screen.getByText("Create my sign-in"));
    expect(await screen.findByText("Use at least 12 characters.")).toBeOnTheScreen();

    fireEvent.changeText(screen.getByLabelText("New password"), "croissant-dough-42");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "croissant-dough-4");
    fireEvent.press(screen.getByText("Create my sign-in"));
    expect(await screen.findByText("The two passwords don't match.")).toBeOnTheScreen();
    expect(api.callsTo("POST", "/api/auth/invitations/accept")).toHaveLength(0);

    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "croissant-dough-42");
    fireEvent.press(screen.getByText("Create my sign-in"));
    expect(await screen.findByTestId("buyer-home-title")).toBeOnTheScreen();
    expect(app.getPathname()).toBe("/buyer");
    expect(api.callsTo("POST", "/api/auth/invitations/accept")[0].body).toEqual({ token: TOKEN, password: "croissant-dough-42", name: "Marisol Okafor" });
  });

  it("asks for a name", async () => {
    mockApi({ [`GET /api/auth/invitations/${TOKEN}`]: { body: { email: "new@hollowbrook.test", role: "baker", name: null } satisfies InvitationPreview } });
    renderApp(`/set-password?kind=invite&token=${TOKEN}`);
    fireEvent.changeText(await screen.findByLabelText("New password"), "croissant-dough-42");
    fireEvent.changeText(screen.getByLabelText("Confirm new password"), "croissant-dough-42");
    fireEvent.press(screen.getByText("Create my sign-in"));
    expect(await screen.findByText("Enter your name.")).toBeOnTheScreen();
  });

  it("shows why an invitation link no longer works", async () => {
    mockApi({
      [`GET /api/auth/invitations/${TOKEN}`]: apiError(400, "token_expired", "This invitation link has expired. Ask for a new one.", { token: "Expired." }),
    });
    renderApp(`/set-password?kind=invite&token=${TOKEN}`);
    expect(await screen.findByTestId("set-password-link-error")).toHaveTextContent(/has expired/);
    await waitForLabelGone("New password");
  });
});
