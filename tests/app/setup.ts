
import { clearSession } from "../../components/auth/storage";
import { setAuthToken, setUnauthorizedHandler } from "../../components/api/client";

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
