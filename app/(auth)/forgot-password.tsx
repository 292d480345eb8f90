import React from "react";
import { ForgotPasswordScreen } from "@/components/screens/auth/ForgotPasswordScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ForgotPasswordRoute() {
  return (
    <>
      <ScreenTitle title="Reset your password" />
      <ForgotPasswordScreen />
    </>
  );
}
