import React from "react";
import { useLocalSearchParams } from "expo-router";
import { BakerHome } from "../../../components/screens/baker/BakerHome";
import { firstParam } from "../../../components/routing";

export default function BakerHomeRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return <BakerHome date={firstParam(date)} />;
}
