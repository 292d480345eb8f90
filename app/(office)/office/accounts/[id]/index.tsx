import React from "react";
import { useLocalSearchParams } from "expo-router";
import { AccountDetailScreen } from "../../../../../components/screens/accounts/AccountDetailScreen";
import { idParam } from "../../../../../components/routing";

export default function AccountRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <AccountDetailScreen key={String(id)} id={idParam(id)} />;
}
