import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { OutboxScreen } from "@/components/screens/billing/OutboxScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OutboxRoute() {
  return (
    <>
      <ScreenTitle title="Outgoing e-mail" />
      <RequireRole roles={["owner", "bookkeeper"]}>
        <OutboxScreen />
      </RequireRole>
    </>
  );
}
