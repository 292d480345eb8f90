import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ForecastScreen } from "../../../components/screens/production/ForecastScreen";
import { firstParam } from "../../../components/routing";

export default function BakerForecastRoute() {
  const { from } = useLocalSearchParams<{ from?: string }>();
  return <ForecastScreen area="baker" from={firstParam(from)} />;
}
