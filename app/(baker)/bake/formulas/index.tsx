import React from "react";
import { FormulasScreen } from "../../../../components/screens/production/FormulaScreens";

export default function BakerFormulasRoute() {
  return <FormulasScreen area="baker" />;
}
