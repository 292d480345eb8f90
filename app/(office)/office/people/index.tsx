import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { PeopleScreen } from "@/components/screens/people/PeopleScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PeopleRoute() {
  const { invited } = useLocalSearchParams<{ invited?: string }>();
  return (
    <>
      <ScreenTitle title="People" />
      <RequireRole roles={["owner"]}>
        <PeopleScreen invited={firstParam(invited)} />
      </RequireRole>
    </>
  );
}
