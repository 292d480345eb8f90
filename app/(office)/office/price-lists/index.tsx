import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { PriceListsScreen } from "../../../../components/screens/pricing/PriceListsScreen";
import { firstParam } from "../../../../components/routing";

export default function PriceListsRoute() {
  const { done } = useLocalSearchParams<{ done?: string }>();
  return (
    <RequireRole roles={["owner"]}>
      <PriceListsScreen notice={firstParam(done)} />
    </RequireRole>
  );
}
