import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { BakeDayScreen } from "../../../../components/screens/production/BakeDayScreen";
import { firstParam } from "../../../../components/routing";

export default function OfficeBakeDayRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <RequireRole roles={["owner"]}>
      <BakeDayScreen area="office" date={firstParam(date)} />
    </RequireRole>
  );
}
