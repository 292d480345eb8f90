
import { clearSession } from "../../components/auth/storage";
import { setAuthToken, setUnauthorizedHandler } from "../../components/api/client";

// A cold transform cache (a fresh CI machine) makes a file's first render take well over Jest's 5 s default.
jest.setTimeout(30000);

beforeEach(() => {
  // renderRouter turns on fake timers; start every test from real ones and an empty session.
  jest.useRealTimers();
  clearSession();
  setAuthToken(null);
  setUnauthorizedHandler(null);
  (globalThis as { fetch?: unknown }).fetch = jest.fn(async () => {
    throw new Error("fetch was called without a mockApi() for this test");
  });
});
