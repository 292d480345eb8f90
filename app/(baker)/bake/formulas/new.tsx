import React from "react";
import { NewFormulaScreen } from "../../../../components/screens/production/FormulaScreens";

export default function BakerNewFormulaRoute() {
  return <NewFormulaScreen area="baker" />;
}
