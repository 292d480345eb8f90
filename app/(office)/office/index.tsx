import React from "react";
import { OfficeHome } from "@/components/screens/office/OfficeHome";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeHomeRoute() {
  return (
    <>
      <ScreenTitle title="Office" />
      <OfficeHome />
    </>
  );
}
