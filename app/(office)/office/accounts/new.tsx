import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { NewAccountScreen } from "../../../../components/screens/accounts/NewAccountScreen";

export default function NewAccountRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <NewAccountScreen />
    </RequireRole>
  );
}
