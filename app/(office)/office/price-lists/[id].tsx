import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { PriceListFormScreen } from "@/components/screens/pricing/PriceListFormScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PriceListRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Price list" />
      <RequireRole roles={["owner"]}>
        <PriceListFormScreen key={String(id)} id={idParam(id)} />
      </RequireRole>
    </>
  );
}
