import React from "react";
import { RequireRole } from "../../../components/auth/RoleGate";
import { CalendarSettingsScreen } from "../../../components/screens/settings/CalendarSettingsScreen";

export default function CalendarSettingsRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <CalendarSettingsScreen />
    </RequireRole>
  );
}
