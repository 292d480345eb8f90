import { fireEvent, screen, waitFor } from "expo-router/testing-library";
import { BAKER, apiError, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { readSession } from "../../components/auth/storage";

describe("sign-out", () => {
  it("ends the session on the server with the current token, then forgets it", async () => {
    signedInAs(BAKER, "tok-baker-1");
    let serverSawToken: string | undefined;
    const api = mockApi({
      ...sessionRoutes(BAKER),
      "POST /api/auth/sign-out": (req) => {
        serverSawToken = req.headers.Authorization;
        // The session is still there while the server is being told.
        expect(readSession()?.token).toBe("tok-baker-1");
        return { status: 204 };
      },
    });
    const app = renderApp("/bake");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("sign-out"));
    await waitFor(() => expect(app.getPathname()).toBe("/sign-in"));
    expect(api.callsTo("POST", "/api/auth/sign-out")).toHaveLength(1);
    expect(serverSawToken).toBe("Bearer tok-baker-1");
    expect(readSession()).toBeNull();
    expect(app.queryClient.getQueryCache().getAll()).toHaveLength(0);
  });

  it("still signs out on this device when the server cannot be told", async () => {
    signedInAs(BAKER, "tok-baker-2");
    mockApi({ ...sessionRoutes(BAKER), "POST /api/auth/sign-out": apiError(500, "internal_error", "Something went wrong on our side. Please try again.") });
    const app = renderApp("/bake");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("sign-out"));
    await waitFor(() => expect(app.getPathname()).toBe("/sign-in"));
    expect(readSession()).toBeNull();
  });

  it("a token the server already ended signs out quietly, without the 'session ended' notice", async () => {
    signedInAs(BAKER, "tok-baker-3");
    mockApi({ ...sessionRoutes(BAKER), "POST /api/auth/sign-out": apiError(401, "unauthorized", "Your session has ended. Sign in again.") });
    const app = renderApp("/bake");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("sign-out"));
    await waitFor(() => expect(app.getPathname()).toBe("/sign-in"));
    expect(readSession()).toBeNull();
    expect(screen.queryByText("Your session ended. Please sign in again.")).toBeNull();
  });

  it("does not wait forever for an unreachable server", async () => {
    signedInAs(BAKER, "tok-baker-4");
    mockApi({ ...sessionRoutes(BAKER), "POST /api/auth/sign-out": () => new Promise(() => undefined) });
    const app = renderApp("/bake");
    expect(await screen.findByTestId("baker-home-title")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("sign-out"));
    await waitFor(() => expect(app.getPathname()).toBe("/sign-in"), { timeout: 8000 });
    expect(readSession()).toBeNull();
  });
});
