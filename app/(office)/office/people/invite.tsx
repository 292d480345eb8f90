import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { InviteScreen } from "@/components/screens/people/InviteScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function InviteRoute() {
  return (
    <>
      <ScreenTitle title="Invite someone" />
      <RequireRole roles={["owner"]}>
        <InviteScreen />
      </RequireRole>
    </>
  );
}
