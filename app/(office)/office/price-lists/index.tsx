import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { PriceListsScreen } from "@/components/screens/pricing/PriceListsScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PriceListsRoute() {
  const { done } = useLocalSearchParams<{ done?: string }>();
  return (
    <>
      <ScreenTitle title="Price lists" />
      <RequireRole roles={["owner"]}>
        <PriceListsScreen notice={firstParam(done)} />
      </RequireRole>
    </>
  );
}
