import { useEffect, useSyncExternalStore } from "react";
import { ROLE_LABELS, type Role } from "../../shared/roles";

/**
 * Why a person was sent elsewhere: a role gate that turns someone away leaves a sentence here for the page it
 * sends them to, which shows it once (components/shell/AppShell.tsx) and forgets it when they move on.
 */
interface RedirectNotice {
  message: string;
  /** The path the person was sent to: the notice shows there only. */
  to: string;
  shown: boolean;
}

let current: RedirectNotice | null = null;
const listeners = new Set<() => void>();
const notify = () => listeners.forEach((l) => l());
const subscribe = (l: () => void) => {
  listeners.add(l);
  return () => listeners.delete(l);
};

export function setRedirectNotice(message: string, to: string) {
  current = { message, to, shown: false };
  notify();
}

export function clearRedirectNotice() {
  if (!current) return;
  current = null;
  notify();
}

const article = (word: string) => (/^[AEIOU]/i.test(word) ? "an" : "a");

/** "That page is for the owner. You're signed in as a bookkeeper, so you're on your own home page instead." */
export function roleRedirectMessage(allowed: readonly Role[], role: Role): string {
  const staffOnly = allowed.every((r) => r !== "buyer");
  const who =
    role === "buyer" && staffOnly
      ? "the bakery's staff"
      : allowed.length === 1
        ? `the ${ROLE_LABELS[allowed[0]].toLowerCase()}`
        : `the ${allowed.slice(0, -1).map((r) => ROLE_LABELS[r].toLowerCase()).join(", ")} and the ${ROLE_LABELS[allowed[allowed.length - 1]].toLowerCase()}`;
  const label = ROLE_LABELS[role].toLowerCase();
  return `That page is for ${who}. You're signed in as ${article(label)} ${label}, so you're on your own home page instead.`;
}

/** The notice for the page at `pathname`, or null; it is forgotten once the person leaves that page. */
export function useRedirectNotice(pathname: string): string | null {
  const notice = useSyncExternalStore(subscribe, () => current, () => current);
  const here = notice && notice.to === pathname ? notice : null;
  useEffect(() => {
    if (!current) return;
    if (current.to === pathname) current.shown = true;
    else if (current.shown) clearRedirectNotice();
  }, [pathname, notice]);
  return here?.message ?? null;
}
