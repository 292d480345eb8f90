import React from "react";
import { AreaLayout } from "@/components/shell/AreaLayout";

export default function OfficeLayout() {
  return <AreaLayout area="office" roles={["owner", "bookkeeper"]} />;
}
