import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { PhoneOrderScreen } from "@/components/screens/phoneorder/PhoneOrderScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PhoneOrderRoute() {
  const { id, date } = useLocalSearchParams<{ id: string; date?: string }>();
  return (
    <>
      <ScreenTitle title="Order by phone" />
      <RequireRole roles={["owner", "bookkeeper"]}>
        <PhoneOrderScreen key={String(id)} accountId={idParam(id)} date={typeof date === "string" ? date : undefined} />
      </RequireRole>
    </>
  );
}
