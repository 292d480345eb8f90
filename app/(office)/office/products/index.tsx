import React from "react";
import { useLocalSearchParams } from "expo-router";
import { ProductsScreen } from "@/components/screens/products/ProductsScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ProductsRoute() {
  const { archived } = useLocalSearchParams<{ archived?: string }>();
  return (
    <>
      <ScreenTitle title="Products" />
      <ProductsScreen archived={firstParam(archived)} />
    </>
  );
}
