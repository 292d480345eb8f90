import React from "react";
import { MoreScreen } from "@/components/screens/office/MoreScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeMoreRoute() {
  return (
    <>
      <ScreenTitle title="More" />
      <MoreScreen area="office" />
    </>
  );
}
