import React from "react";
import { useLocalSearchParams } from "expo-router";
import { SetPasswordScreen } from "@/components/screens/auth/SetPasswordScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function SetPasswordRoute() {
  const params = useLocalSearchParams<{ kind?: string; token?: string; email?: string }>();
  return (
    <>
      <ScreenTitle title={firstParam(params.kind) === "invite" ? "Accept your invitation" : "Choose a new password"} />
      <SetPasswordScreen kind={firstParam(params.kind)} token={firstParam(params.token)} email={firstParam(params.email)} />
    </>
  );
}
