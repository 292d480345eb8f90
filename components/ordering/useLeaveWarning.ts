import { useEffect } from "react";
import { Platform } from "react-native";

/**
 * While `active` (an order with unsaved changes), closing or reloading the browser tab asks first: the web's
 * `beforeunload` prompt (the browser writes its own words; a page cannot). On native there is no such event.
 */
export function useLeaveWarning(active: boolean): void {
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
