import React, { createContext, useCallback, useEffect, useMemo, useRef, useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { ApiError, setAuthToken, setUnauthorizedHandler } from "../api/client";
import { authApi } from "../api/auth";
import { clearSession, readSession, writeSession } from "./storage";
import type { SessionUser } from "../../shared/schemas/auth";

export type AuthStatus = "loading" | "signedOut" | "signedIn";

export interface AuthContextValue {
  status: AuthStatus;
  user: SessionUser | null;
  token: string | null;
  /** Keep a session the API handed out (sign-in, accepted invitation, reset password). */
  signIn: (session: { token: string; user: SessionUser }) => void;
  /** End the session on the server, then forget it and everything fetched with it (locally even if the server call fails). */
  signOut: () => Promise<void>;
  /** Why the last session ended on its own (expired, turned off), for the sign-in screen. */
  endedMessage: string | null;
}

export const AuthContext = createContext<AuthContextValue | null>(null);

/** How long sign-out waits for the server before forgetting the session anyway. */
export const SIGN_OUT_TIMEOUT_MS = 5000;

export function AuthProvider({ children }: { children: React.ReactNode }) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<{ status: AuthStatus; user: SessionUser | null; token: string | null }>(() => {
    const stored = readSession();
    if (stored) setAuthToken(stored.token);
    return stored ? { status: "loading", user: stored.user, token: stored.token } : { status: "signedOut", user: null, token: null };
  });
  const [endedMessage, setEndedMessage] = useState<string | null>(null);
  const tokenRef = useRef(state.token);

  const signOut = useCallback(() => {
    tokenRef.current = null;
    setAuthToken(null);
    clearSession();
    queryClient.cancelQueries().catch(() => undefined);
    queryClient.clear();
    setState({ status: "signedOut", user: null, token: null });
  }, [queryClient]);

  const signIn = useCallback(
    (session: { token: string; user: SessionUser }) => {
      // A different person may have used this browser: start from an empty cache.
      queryClient.clear();
      tokenRef.current = session.token;
      setAuthToken(session.token);
      writeSession(session);
      setEndedMessage(null);
      setState({ status: "signedIn", user: session.user, token: session.token });
    },
    [queryClient],
  );

  // A 401 on any authenticated call ends the session.
  useEffect(() => {
    setUnauthorizedHandler(() => {
      if (!tokenRef.current) return;
      setEndedMessage("Your session ended. Please sign in again.");
      signOut();
    });
    return () => setUnauthorizedHandler(null);
  }, [signOut]);

  // At start-up, check a stored token with the server (and pick up a changed name or role).
  useEffect(() => {
    if (state.status !== "loading" || !state.token) return;
    let cancelled = false;
    const token = state.token;
    authApi
      .me()
      .then(({ user }) => {
        if (cancelled || tokenRef.current !== token) return;
        writeSession({ token, user });
        setState({ status: "signedIn", user, token });
      })
      .catch((err: unknown) => {
        if (cancelled || tokenRef.current !== token) return;
        if (err instanceof ApiError && err.status === 401) {
          signOut();
        } else {
          // Offline or the server is busy: carry on with the stored user; later calls will tell.
          setState((s) => ({ ...s, status: "signedIn" }));
        }
      });
    return () => {
      cancelled = true;
    };
    // Only on start-up.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const signOutByChoice = useCallback(async () => {
    setEndedMessage(null);
    const token = tokenRef.current;
    // Quiet the 401 handler: a token that is already dead must not show "Your session ended".
    tokenRef.current = null;
    if (token) {
      // Tell the server first, so the token stops working everywhere; give up after a few seconds when it cannot be
      // reached — signing out on this device must never depend on the network.
      let timer: ReturnType<typeof setTimeout> | undefined;
      await Promise.race([
        authApi.signOut().catch(() => undefined),
        new Promise<void>((resolve) => {
          timer = setTimeout(resolve, SIGN_OUT_TIMEOUT_MS);
        }),
      ]);
      if (timer) clearTimeout(timer);
    }
    signOut();
  }, [signOut]);

  const value = useMemo<AuthContextValue>(
    () => ({ ...state, signIn, signOut: signOutByChoice, endedMessage }),
    [state, signIn, signOutByChoice, endedMessage],
  );
  return <AuthContext.Provider value={value}>{children}</AuthContext.Provider>;
}
