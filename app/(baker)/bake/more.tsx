import React from "react";
import { MoreScreen } from "../../../components/screens/office/MoreScreen";

export default function BakerMoreRoute() {
  return <MoreScreen area="baker" />;
}
