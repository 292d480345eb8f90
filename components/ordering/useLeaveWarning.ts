import { useEffect } from "react";
import { Platform } from "react-native";
import { useLeaveGuard } from "../shell/leaveGuard";

/**
 * While `active` (an order with unsaved changes), leaving asks first: a link inside the app asks `question`
 * (components/shell/leaveGuard.ts), and closing or reloading the browser tab shows the web's `beforeunload`
 * prompt (the browser writes its own words; a page cannot). On native there is no such event.
 */
export function useLeaveWarning(active: boolean, question = "Your changes to this order are not saved yet. Leave without saving them?"): void {
  useLeaveGuard(active, question);
  useEffect(() => {
    if (!active || Platform.OS !== "web" || typeof window === "undefined") return;
    const ask = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      event.returnValue = "";
    };
    window.addEventListener("beforeunload", ask);
    return () => window.removeEventListener("beforeunload", ask);
  }, [active]);
}
