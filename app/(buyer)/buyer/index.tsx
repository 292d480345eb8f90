import React from "react";
import { BuyerHome } from "@/components/screens/buyer/BuyerHome";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BuyerHomeRoute() {
  return (
    <>
      <ScreenTitle title="Home" />
      <BuyerHome />
    </>
  );
}
