import React from "react";
import { FormulasScreen } from "@/components/screens/production/formulas/FormulasScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerFormulasRoute() {
  return (
    <>
      <ScreenTitle title="Formulas" />
      <FormulasScreen area="baker" />
    </>
  );
}
