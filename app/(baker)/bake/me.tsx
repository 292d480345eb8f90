import React from "react";
import { ProfileScreen } from "@/components/screens/common/ProfileScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerProfileRoute() {
  return (
    <>
      <ScreenTitle title="Profile" />
      <ProfileScreen />
    </>
  );
}
