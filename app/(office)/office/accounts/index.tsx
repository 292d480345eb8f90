import React from "react";
import { AccountsListScreen } from "@/components/screens/accounts/AccountsListScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function AccountsRoute() {
  return (
    <>
      <ScreenTitle title="Accounts" />
      <AccountsListScreen />
    </>
  );
}
