import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { NewAccountScreen } from "@/components/screens/accounts/NewAccountScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function NewAccountRoute() {
  return (
    <>
      <ScreenTitle title="New account" />
      <RequireRole roles={["owner"]}>
        <NewAccountScreen />
      </RequireRole>
    </>
  );
}
