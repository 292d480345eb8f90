import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { BakeDayScreen } from "@/components/screens/production/BakeDayScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeBakeDayRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Bake day" />
      <RequireRole roles={["owner"]}>
        <BakeDayScreen area="office" date={firstParam(date)} />
      </RequireRole>
    </>
  );
}
