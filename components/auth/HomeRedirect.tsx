import React from "react";
import { RoleGate } from "./RoleGate";

/** "/": signed out goes to sign-in, signed in goes to the role's home (a gate that lets no role stay). */
export function HomeRedirect() {
  return <RoleGate roles={[]}>{null}</RoleGate>;
}
