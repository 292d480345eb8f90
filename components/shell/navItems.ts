import type Feather from "@expo/vector-icons/Feather";
import type React from "react";
import type { HomeArea, Role } from "../../shared/roles";

export interface NavItem {
  key: string;
  label: string;
  href: string;
  icon: React.ComponentProps<typeof Feather>["name"];
  /** Active only on this exact path (homes); otherwise also on its sub-paths. */
  exact?: boolean;
  /** Roles that see this item (default: everyone in the area). */
  roles?: readonly Role[];
}

export const NAV: Record<HomeArea, NavItem[]> = {
  buyer: [
    { key: "home", label: "Home", href: "/buyer", icon: "home", exact: true },
    { key: "account", label: "Account", href: "/buyer/account", icon: "briefcase" },
    { key: "me", label: "You", href: "/buyer/me", icon: "user" },
  ],
  baker: [
    { key: "bake", label: "Bake day", href: "/bake", icon: "sun", exact: true },
    { key: "me", label: "You", href: "/bake/me", icon: "user" },
  ],
  office: [
    { key: "office", label: "Overview", href: "/office", icon: "grid", exact: true },
    { key: "people", label: "People", href: "/office/people", icon: "users", roles: ["owner"] },
    { key: "accounts", label: "Accounts", href: "/office/accounts", icon: "briefcase" },
    { key: "me", label: "You", href: "/office/me", icon: "user" },
  ],
};

export const AREA_LABEL: Record<HomeArea, string> = {
  buyer: "Café ordering",
  baker: "Bake day",
  office: "Office",
};

export function navFor(area: HomeArea, role: Role): NavItem[] {
  return NAV[area].filter((item) => !item.roles || item.roles.includes(role));
}

export function isActive(item: NavItem, pathname: string): boolean {
  if (item.exact) return pathname === item.href || pathname === `${item.href}/`;
  return pathname === item.href || pathname.startsWith(`${item.href}/`);
}
