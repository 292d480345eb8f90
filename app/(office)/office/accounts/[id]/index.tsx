import React from "react";
import { useLocalSearchParams } from "expo-router";
import { AccountDetailScreen } from "@/components/screens/accounts/AccountDetailScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function AccountRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Account" />
      <AccountDetailScreen key={String(id)} id={idParam(id)} />
    </>
  );
}
