import React from "react";
import { Slot } from "expo-router";
import { RoleGate } from "../auth/RoleGate";
import { AppShell } from "./AppShell";
import type { HomeArea, Role } from "../../shared/roles";

/** A signed-in group's layout: check the role, then frame the screens with that area's navigation. */
export function AreaLayout({ area, roles }: { area: HomeArea; roles: readonly Role[] }) {
  return (
    <RoleGate roles={roles}>
      <AppShell area={area}>
        <Slot />
      </AppShell>
    </RoleGate>
  );
}
