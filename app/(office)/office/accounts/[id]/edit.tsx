import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { EditAccountScreen } from "@/components/screens/accounts/EditAccountScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function EditAccountRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Edit account" />
      <RequireRole roles={["owner"]}>
        <EditAccountScreen key={String(id)} id={idParam(id)} />
      </RequireRole>
    </>
  );
}
