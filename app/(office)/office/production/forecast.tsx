import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { ForecastScreen } from "@/components/screens/production/ForecastScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeForecastRoute() {
  const { from } = useLocalSearchParams<{ from?: string }>();
  return (
    <>
      <ScreenTitle title="Purchasing" />
      <RequireRole roles={["owner"]}>
        <ForecastScreen area="office" from={firstParam(from)} />
      </RequireRole>
    </>
  );
}
