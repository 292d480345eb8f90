import { sessionUserSchema, type SessionUser } from "../../shared/schemas/auth";

/** Where the session lives: localStorage on the web, memory elsewhere (native without storage, Jest). */
export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

const memory = new Map<string, string>();
const memoryStore: KeyValueStore = {
  getItem: (k) => memory.get(k) ?? null,
  setItem: (k, v) => void memory.set(k, v),
  removeItem: (k) => void memory.delete(k),
};

function webStore(): KeyValueStore | null {
  try {
    const ls = (globalThis as { localStorage?: Storage }).localStorage;
    if (!ls) return null;
    const probe = "__panwise_probe__";
    ls.setItem(probe, "1");
    ls.removeItem(probe);
    return ls;
  } catch {
    // Private mode or storage turned off.
    return null;
  }
}

export function sessionStore(): KeyValueStore {
  return webStore() ?? memoryStore;
}

export const SESSION_KEY = "panwise.session.v1";

export interface StoredSession {
  token: string;
  user: SessionUser;
}

export function readSession(): StoredSession | null {
  try {
    const raw = sessionStore().getItem(SESSION_KEY);
    if (!raw) return null;
    const parsed = JSON.parse(raw) as { token?: unknown; user?: unknown };
    const user = sessionUserSchema.safeParse(parsed.user);
    if (typeof parsed.token !== "string" || !parsed.token || !user.success) return null;
    return { token: parsed.token, user: user.data };
  } catch {
    return null;
  }
}

export function writeSession(session: StoredSession): void {
  try {
    sessionStore().setItem(SESSION_KEY, JSON.stringify(session));
  } catch {
    // Storage full or refused: the session still works until the page reloads.
  }
}

export function clearSession(): void {
  try {
    sessionStore().removeItem(SESSION_KEY);
  } catch {
    // Nothing to clear.
  }
}
