import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { CalendarSettingsScreen } from "@/components/screens/settings/CalendarSettingsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function CalendarSettingsRoute() {
  return (
    <>
      <ScreenTitle title="Delivery days" />
      <RequireRole roles={["owner"]}>
        <CalendarSettingsScreen />
      </RequireRole>
    </>
  );
}
