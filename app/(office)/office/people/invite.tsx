import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { InviteScreen } from "../../../../components/screens/people/InviteScreen";

export default function InviteRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <InviteScreen />
    </RequireRole>
  );
}
