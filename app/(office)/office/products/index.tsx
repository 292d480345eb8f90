import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ProductsScreen } from "../../../../components/screens/products/ProductsScreen";
import { firstParam } from "../../../../components/routing";

export default function ProductsRoute() {
  const { archived } = useLocalSearchParams<{ archived?: string }>();
  return <ProductsScreen archived={firstParam(archived)} />;
}
