import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ProductDetailScreen } from "../../../../components/screens/products/ProductDetailScreen";
import { firstParam, idParam } from "../../../../components/routing";

export default function ProductRoute() {
  const { id, created } = useLocalSearchParams<{ id: string; created?: string }>();
  return <ProductDetailScreen key={String(id)} id={idParam(id)} created={firstParam(created) === "1"} />;
}
