import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { ConfirmDispatchScreen } from "@/components/screens/board/ConfirmDispatchScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function DispatchRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Deliveries" />
      <RequireRole roles={["owner"]}>
        <ConfirmDispatchScreen date={firstParam(date)} />
      </RequireRole>
    </>
  );
}
