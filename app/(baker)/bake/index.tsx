import React from "react";
import { useLocalSearchParams } from "expo-router";
import { BakerHome } from "@/components/screens/baker/BakerHome";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerHomeRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Bake day" />
      <BakerHome date={firstParam(date)} />
    </>
  );
}
