import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { FormulaScreen } from "@/components/screens/production/formulas/FormulaScreen";
import { firstParam, idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeFormulaRoute() {
  const { id, version, created } = useLocalSearchParams<{ id: string; version?: string; created?: string }>();
  const v = idParam(version);
  return (
    <>
      <ScreenTitle title="Formula" />
      <RequireRole roles={["owner"]}>
        <FormulaScreen key={String(id)} area="office" id={idParam(id)} version={Number.isNaN(v) ? undefined : v} created={firstParam(created) === "1"} />
      </RequireRole>
    </>
  );
}
