import React from "react";
import { useLocalSearchParams } from "expo-router";
import { BakeDayScreen } from "../../../components/screens/production/BakeDayScreen";
import { firstParam } from "../../../components/routing";

export default function BakeDayRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return <BakeDayScreen area="baker" date={firstParam(date)} />;
}
