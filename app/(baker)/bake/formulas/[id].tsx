import React from "react";
import { useLocalSearchParams } from "expo-router";
import { FormulaScreen } from "@/components/screens/production/formulas/FormulaScreen";
import { firstParam, idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerFormulaRoute() {
  const { id, version, created } = useLocalSearchParams<{ id: string; version?: string; created?: string }>();
  const v = idParam(version);
  return (
    <>
      <ScreenTitle title="Formula" />
      <FormulaScreen key={String(id)} area="baker" id={idParam(id)} version={Number.isNaN(v) ? undefined : v} created={firstParam(created) === "1"} />
    </>
  );
}
