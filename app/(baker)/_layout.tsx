import React from "react";
import { AreaLayout } from "@/components/shell/AreaLayout";

export default function BakerLayout() {
  return <AreaLayout area="baker" roles={["baker"]} />;
}
