import { fireEvent, screen } from "expo-router/testing-library";
import { ApiError, api, setAuthToken, setUnauthorizedHandler } from "../../components/api/client";
import { splitError } from "../../components/forms/errors";
import { accountKeys } from "../../components/api/accounts";
import { mockApi, apiError, renderApp } from "./helpers";

describe("api client", () => {
  it("sends the bearer token and parses JSON", async () => {
    const fake = mockApi({ "GET /api/bakery": { body: { bakery: { name: "Hollowbrook Bakehouse" } } } });
    setAuthToken("tok-1");
    await expect(api("/api/bakery")).resolves.toEqual({ bakery: { name: "Hollowbrook Bakehouse" } });
    expect(fake.calls[0].headers.Authorization).toBe("Bearer tok-1");
  });

  it("turns the error body into an ApiError with status, code, message and fields", async () => {
    mockApi({ "POST /api/accounts": apiError(400, "validation_failed", "Some fields need attention.", { businessName: "Enter the business name.", "lines.0": "x" }) });
    const err = await api("/api/accounts", { method: "POST", body: {} }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 400, code: "validation_failed", message: "Some fields need attention.", fields: { businessName: "Enter the business name." } });
    expect(splitError(err, ["businessName"])).toEqual({ formError: "Some fields need attention.", fields: { businessName: "Enter the business name." } });
    expect(splitError(err, ["businessName", "lines.0"]).formError).toBeNull();
  });

  it("keeps the server's request id (error.requestId) for a person to quote", async () => {
    mockApi({ "GET /api/orders": { status: 500, body: { error: { code: "internal_error", message: "Something went wrong on our side. Please try again.", requestId: "4f9c2d1e-7a3b-4c5d-9e8f-0a1b2c3d4e5f" } } } });
    const err = await api("/api/orders").catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 500, code: "internal_error", requestId: "4f9c2d1e-7a3b-4c5d-9e8f-0a1b2c3d4e5f" });
    mockApi({ "GET /api/orders": apiError(404, "not_found", "That was not found.") });
    expect(((await api("/api/orders").catch((e: unknown) => e)) as ApiError).requestId).toBeUndefined();
  });

  it("reports a failed connection as network_error", async () => {
    (globalThis as { fetch?: unknown }).fetch = jest.fn(async () => {
      throw new TypeError("Failed to fetch");
    });
    await expect(api("/api/bakery")).rejects.toMatchObject({ status: 0, code: "network_error" });
  });

  it("calls the sign-out handler on a 401 only when a token was sent", async () => {
    mockApi({ "GET /api/users": apiError(401, "unauthorized", "Sign in to continue.") });
    const handler = jest.fn();
    setUnauthorizedHandler(handler);
    await api("/api/users").catch(() => undefined);
    expect(handler).not.toHaveBeenCalled();
    setAuthToken("tok-1");
    await api("/api/users").catch(() => undefined);
    expect(handler).toHaveBeenCalledTimes(1);
  });

  it("builds query strings without empty values, and keys per params", async () => {
    const fake = mockApi({ "GET /api/accounts": { body: { accounts: [] } } });
    await api("/api/accounts", { query: { q: "pier & co", status: undefined, empty: "" } });
    expect(fake.calls[0].query).toEqual({ q: "pier & co" });
    expect(accountKeys.list({ q: "a" })).toEqual(["accounts", "list", { q: "a", status: "" }]);
    expect(accountKeys.detail(3)).toEqual(["accounts", "detail", 3]);
  });
});

describe("forgot password", () => {
  it("shows the server's message after asking for a link", async () => {
    const fake = mockApi({ "POST /api/auth/password-reset": { status: 202, body: { message: "If that e-mail has a sign-in, a reset link is on its way. It works for 1 hour." } } });
    renderApp("/forgot-password");
    fireEvent.press(await screen.findByText("Send reset link"));
    expect(await screen.findByText("Enter an e-mail address.")).toBeOnTheScreen();
    fireEvent.changeText(screen.getByLabelText("E-mail"), "baker@hollowbrook.test");
    fireEvent.press(screen.getByText("Send reset link"));
    expect(await screen.findByTestId("forgot-password-sent")).toHaveTextContent(/reset link is on its way/);
    expect(fake.calls[0].body).toEqual({ email: "baker@hollowbrook.test" });
  });
});
