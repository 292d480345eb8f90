import React from "react";
import { AreaLayout } from "@/components/shell/AreaLayout";

export default function BuyerLayout() {
  return <AreaLayout area="buyer" roles={["buyer"]} />;
}
