import React from "react";
import { NewFormulaScreen } from "@/components/screens/production/formulas/NewFormulaScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerNewFormulaRoute() {
  return (
    <>
      <ScreenTitle title="New formula" />
      <NewFormulaScreen area="baker" />
    </>
  );
}
