import React from "react";
import { RequireRole } from "../../../components/auth/RoleGate";
import { OutboxScreen } from "../../../components/screens/billing/OutboxScreen";

export default function OutboxRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <OutboxScreen />
    </RequireRole>
  );
}
