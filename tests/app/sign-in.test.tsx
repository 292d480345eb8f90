import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { OWNER, apiError, mockApi, renderApp, sessionRoutes } from "./helpers";
import { readSession } from "../../components/auth/storage";

describe("sign-in screen", () => {
  it("shows a message next to each field on an empty submit and calls no API", async () => {
    const api = mockApi({});
    renderApp("/sign-in");
    fireEvent.press(await screen.findByText("Sign in"));
    expect(await screen.findByText("Enter an e-mail address.")).toBeOnTheScreen();
    expect(screen.getByText("Enter your password.")).toBeOnTheScreen();
    expect(screen.getByTestId("sign-in-email-error")).toHaveTextContent("Enter an e-mail address.");
    expect(api.calls).toHaveLength(0);
  });

  it("shows the server's message at the top of the form on 401", async () => {
    const api = mockApi({
      "POST /api/auth/sign-in": apiError(401, "invalid_credentials", "That e-mail and password don't match a sign-in. Check both and try again."),
    });
    renderApp("/sign-in");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "Owner@Hollowbrook.test ");
    fireEvent.changeText(screen.getByLabelText("Password"), "wrong-password");
    fireEvent.press(screen.getByText("Sign in"));
    expect(await screen.findByTestId("sign-in-error")).toHaveTextContent(/That e-mail and password don.t match a sign-in\. Check both and try again\./);
    // The schema trims and lower-cases the e-mail before it goes out; no token is sent.
    expect(api.calls[0].body).toEqual({ email: "owner@hollowbrook.test", password: "wrong-password" });
    expect(api.calls[0].headers.Authorization).toBeUndefined();
    expect(readSession()).toBeNull();
  });

  it("shows the too-many-attempts message on 429", async () => {
    mockApi({
      "POST /api/auth/sign-in": apiError(429, "too_many_attempts", "Too many sign-in attempts. Try again in 15 minutes, or reset your password."),
    });
    renderApp("/sign-in");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "owner@hollowbrook.test");
    fireEvent.changeText(screen.getByLabelText("Password"), "x");
    fireEvent.press(screen.getByText("Sign in"));
    expect(await screen.findByText(/Too many sign-in attempts/)).toBeOnTheScreen();
  });

  it("signs in, keeps the session and goes to the role's home", async () => {
    const api = mockApi({
      ...sessionRoutes(OWNER),
      "POST /api/auth/sign-in": { body: { token: "tok-owner", user: OWNER } },
      "GET /api/office/summary": { body: { summary: { users: { total: 4, active: 4, disabled: 0, pendingInvitations: 0 }, accounts: { total: 3, active: 3, onHold: 0, paused: 0, creditHold: 0, closed: 0 } } } },
    });
    const app = renderApp("/sign-in");
    fireEvent.changeText(await screen.findByLabelText("E-mail"), "owner@hollowbrook.test");
    fireEvent.changeText(screen.getByLabelText("Password"), "panwise-demo");
    fireEvent.press(screen.getByText("Sign in"));
    expect(await screen.findByTestId("office-home-title")).toHaveTextContent("Office");
    expect(app.getPathname()).toBe("/office");
    expect(readSession()).toEqual({ token: "tok-owner", user: OWNER });
    await waitFor(() => expect(api.callsTo("GET", "/api/office/summary")[0]?.headers.Authorization).toBe("Bearer tok-owner"));
  });
});
