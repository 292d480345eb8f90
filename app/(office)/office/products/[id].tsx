import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ProductDetailScreen } from "@/components/screens/products/ProductDetailScreen";
import { firstParam, idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ProductRoute() {
  const { id, created } = useLocalSearchParams<{ id: string; created?: string }>();
  return (
    <>
      <ScreenTitle title="Product" />
      <ProductDetailScreen key={String(id)} id={idParam(id)} created={firstParam(created) === "1"} />
    </>
  );
}
