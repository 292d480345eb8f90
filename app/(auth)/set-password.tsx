import React from "react";
import { useLocalSearchParams } from "expo-router";
import { SetPasswordScreen } from "../../components/screens/auth/SetPasswordScreen";
import { firstParam } from "../../components/routing";

export default function SetPasswordRoute() {
  const params = useLocalSearchParams<{ kind?: string; token?: string; email?: string }>();
  return <SetPasswordScreen kind={firstParam(params.kind)} token={firstParam(params.token)} email={firstParam(params.email)} />;
}
