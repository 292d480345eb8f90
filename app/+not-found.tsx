import React from "react";
import { NotFoundScreen } from "@/components/screens/common/NotFoundScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function NotFoundRoute() {
  return (
    <>
      <ScreenTitle title="There's no page here" />
      <NotFoundScreen />
    </>
  );
}
