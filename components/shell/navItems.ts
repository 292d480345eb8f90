import type Feather from "@expo/vector-icons/Feather";
import type React from "react";
import type { HomeArea, Role } from "../../shared/roles";
import type { RoutePath } from "../routing";

export interface NavItem {
  key: string;
  label: string;
  href: RoutePath;
  icon: React.ComponentProps<typeof Feather>["name"];
  /** Active only on this exact path (homes); otherwise also on its sub-paths. */
  exact?: boolean;
  /** Other paths (and their sub-paths) that belong to this item, e.g. a home's own detail pages. */
  alsoFor?: string[];
  /** Roles that see this item (default: everyone in the area). */
  roles?: readonly Role[];
}

export const NAV: Record<HomeArea, NavItem[]> = {
  buyer: [
    { key: "home", label: "Home", href: "/buyer", icon: "home", exact: true, alsoFor: ["/buyer/order"] },
    { key: "standing", label: "Standing order", href: "/buyer/standing", icon: "repeat" },
    { key: "history", label: "Orders", href: "/buyer/orders", icon: "list" },
    { key: "invoices", label: "Invoices", href: "/buyer/invoices", icon: "file-text" },
    { key: "account", label: "Account", href: "/buyer/account", icon: "briefcase", alsoFor: ["/buyer/me"] },
  ],
  baker: [
    { key: "bake", label: "Bake day", href: "/bake", icon: "sun", exact: true, alsoFor: ["/bake/day"] },
    { key: "orders", label: "Orders", href: "/bake/orders", icon: "clipboard" },
    { key: "formulas", label: "Formulas", href: "/bake/formulas", icon: "book-open" },
    { key: "forecast", label: "Purchasing", href: "/bake/forecast", icon: "shopping-cart" },
    { key: "ingredients", label: "Ingredients", href: "/bake/ingredients", icon: "package" },
    { key: "me", label: "Profile", href: "/bake/me", icon: "user" },
  ],
  office: [
    { key: "office", label: "Overview", href: "/office", icon: "grid", exact: true },
    { key: "orders", label: "Orders", href: "/office/orders", icon: "clipboard", alsoFor: ["/office/dispatch"] },
    { key: "invoices", label: "Invoices", href: "/office/invoices", icon: "file-text", roles: ["owner", "bookkeeper"] },
    { key: "accounts", label: "Accounts", href: "/office/accounts", icon: "briefcase" },
    { key: "products", label: "Products", href: "/office/products", icon: "shopping-bag" },
    { key: "production", label: "Production", href: "/office/production", icon: "layers", roles: ["owner"] },
    { key: "people", label: "People", href: "/office/people", icon: "users", roles: ["owner"] },
    { key: "price-lists", label: "Price lists", href: "/office/price-lists", icon: "tag", roles: ["owner"] },
    { key: "calendar", label: "Delivery days", href: "/office/calendar", icon: "calendar", roles: ["owner"] },
    { key: "money", label: "Money", href: "/office/money", icon: "dollar-sign", roles: ["owner", "bookkeeper"] },
    { key: "outbox", label: "Outgoing e-mail", href: "/office/outbox", icon: "mail", roles: ["owner", "bookkeeper"] },
    { key: "me", label: "Profile", href: "/office/me", icon: "user" },
  ],
};

export const AREA_LABEL: Record<HomeArea, string> = {
  buyer: "Wholesale ordering",
  baker: "Bake day",
  office: "Office",
};

/** The bottom tab bar holds at most this many; past it, the last tab is "More". */
export const MAX_TABS = 5;

/** Where "More" lists the rest (the office and the baker have more than five items). */
export const MORE_HREF: Partial<Record<HomeArea, RoutePath>> = { office: "/office/more", baker: "/bake/more" };

export function navFor(area: HomeArea, role: Role): NavItem[] {
  return NAV[area].filter((item) => !item.roles || item.roles.includes(role));
}

/** The bottom tabs: all items when they fit, else the first four and a "More" tab for the rest. */
export function tabsFor(area: HomeArea, role: Role): { tabs: NavItem[]; more: NavItem[] } {
  const items = navFor(area, role);
  const moreHref = MORE_HREF[area];
  if (items.length <= MAX_TABS || !moreHref) return { tabs: items, more: [] };
  const shown = items.slice(0, MAX_TABS - 1);
  const more = items.slice(MAX_TABS - 1);
  return {
    tabs: [...shown, { key: "more", label: "More", href: moreHref, icon: "menu", alsoFor: more.map((m) => m.href) }],
    more,
  };
}

function onPath(href: string, pathname: string): boolean {
  return pathname === href || pathname.startsWith(`${href}/`);
}

export function isActive(item: NavItem, pathname: string): boolean {
  if (item.alsoFor?.some((p) => onPath(p, pathname))) return true;
  if (item.exact) return pathname === item.href || pathname === `${item.href}/`;
  return onPath(item.href, pathname);
}
