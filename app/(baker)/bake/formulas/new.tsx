import React from "react";
import { NewFormulaScreen } from "../../../../components/screens/production/formulas/NewFormulaScreen";

export default function BakerNewFormulaRoute() {
  return <NewFormulaScreen area="baker" />;
}
