import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { NewProductScreen } from "@/components/screens/products/NewProductScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function NewProductRoute() {
  return (
    <>
      <ScreenTitle title="New product" />
      <RequireRole roles={["owner"]}>
        <NewProductScreen />
      </RequireRole>
    </>
  );
}
