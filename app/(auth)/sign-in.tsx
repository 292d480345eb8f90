import React from "react";
import { SignInScreen } from "@/components/screens/auth/SignInScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function SignInRoute() {
  return (
    <>
      <ScreenTitle title="Sign in" />
      <SignInScreen />
    </>
  );
}
