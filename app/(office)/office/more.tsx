import React from "react";
import { MoreScreen } from "../../../components/screens/office/MoreScreen";

export default function OfficeMoreRoute() {
  return <MoreScreen area="office" />;
}
