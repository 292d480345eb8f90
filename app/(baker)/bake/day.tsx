import React from "react";
import { useLocalSearchParams } from "expo-router";
import { BakeDayScreen } from "@/components/screens/production/BakeDayScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakeDayRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Bake day" />
      <BakeDayScreen area="baker" date={firstParam(date)} />
    </>
  );
}
