import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ForecastScreen } from "@/components/screens/production/ForecastScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerForecastRoute() {
  const { from } = useLocalSearchParams<{ from?: string }>();
  return (
    <>
      <ScreenTitle title="Purchasing" />
      <ForecastScreen area="baker" from={firstParam(from)} />
    </>
  );
}
