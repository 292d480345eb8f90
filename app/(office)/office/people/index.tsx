import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { PeopleScreen } from "../../../../components/screens/people/PeopleScreen";
import { firstParam } from "../../../../components/routing";

export default function PeopleRoute() {
  const { invited } = useLocalSearchParams<{ invited?: string }>();
  return (
    <RequireRole roles={["owner"]}>
      <PeopleScreen invited={firstParam(invited)} />
    </RequireRole>
  );
}
