import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { NewProductScreen } from "../../../../components/screens/products/NewProductScreen";

export default function NewProductRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <NewProductScreen />
    </RequireRole>
  );
}
