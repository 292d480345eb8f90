import React from "react";
import { FormulasScreen } from "../../../../components/screens/production/formulas/FormulasScreen";

export default function BakerFormulasRoute() {
  return <FormulasScreen area="baker" />;
}
