import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { ForecastScreen } from "../../../../components/screens/production/ForecastScreen";
import { firstParam } from "../../../../components/routing";

export default function OfficeForecastRoute() {
  const { from } = useLocalSearchParams<{ from?: string }>();
  return (
    <RequireRole roles={["owner"]}>
      <ForecastScreen area="office" from={firstParam(from)} />
    </RequireRole>
  );
}
