import { useEffect } from "react";
import { Platform } from "react-native";

/**
 * "Leave without saving?" for links inside the app. A screen with unsaved changes registers its question
 * (useLeaveGuard); every app link (navigation, text links, cards, link buttons) asks it before moving on, and
 * stays put when the person says no. Web only: it uses the browser's confirm dialog, which blocks until
 * answered; on native no link asks. Closing or reloading the tab is the browser's own prompt (useLeaveWarning).
 */
let question: string | null = null;

export function useLeaveGuard(active: boolean, text: string): void {
  useEffect(() => {
    if (!active) return;
    question = text;
    return () => {
      if (question === text) question = null;
    };
  }, [active, text]);
}

/** True when the person may leave (nothing unsaved, or they said yes). */
export function confirmLeave(): boolean {
  if (!question || Platform.OS !== "web" || typeof window === "undefined" || typeof window.confirm !== "function") return true;
  const ok = window.confirm(question);
  if (ok) question = null;
  return ok;
}

/** A Link's onPress: cancels the navigation when the person chooses to stay. */
export function guardLinkPress(event: { preventDefault(): void }): void {
  if (!confirmLeave()) event.preventDefault();
}
