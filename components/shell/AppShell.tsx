import React from "react";
import { Platform, Pressable, StyleSheet, View, ScrollView, useWindowDimensions } from "react-native";
import { Link, usePathname } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { useSafeAreaInsets } from "react-native-safe-area-context";
import { colors, layout, radii, space } from "../theme";
import { AppText } from "../ui/Text";
import { useAuth } from "../auth/useAuth";
import { BrandMark } from "./BrandMark";
import { LinkPressable } from "../ui/LinkPressable";
import { AREA_LABEL, isActive, navFor, tabsFor, type NavItem } from "./navItems";
import { useIsWide } from "./useIsWide";
import { ROLE_LABELS, type HomeArea } from "../../shared/roles";
import { guardLinkPress } from "./leaveGuard";
import { clearRedirectNotice, useRedirectNotice } from "./redirectNotice";

/** Web landmarks (<nav>, <main>); React Native's own role list has no such roles. */
function landmark(role: "navigation" | "main"): object {
  return Platform.OS === "web" ? { role } : {};
}

/**
 * The frame around every signed-in screen. Under 1024 px: a top bar (name, Sign out), one column and a
 * bottom tab bar. From 1024 px: a left side navigation and the content beside it.
 */
export function AppShell({ area, children }: { area: HomeArea; children: React.ReactNode }) {
  const wide = useIsWide();
  const { user, signOut } = useAuth();
  const pathname = usePathname();
  // The owner's twelve entries need about 890 px at full spacing; a laptop's window is often 800 px or less.
  const short = useWindowDimensions().height < SHORT_WINDOW;
  if (!user) return null;
  const items = navFor(area, user.role);

  if (wide) {
    return (
      <View style={styles.wideRoot} testID="app-shell-wide">
        <View style={[styles.side, short && styles.sideShort]} {...landmark("navigation")} aria-label="Main">
          <View style={styles.sideBrand}>
            <BrandMark onDark />
            <AppText variant="overline" color="navMuted">
              {AREA_LABEL[area]}
            </AppText>
          </View>
          {/* Scrolls when the list is taller than the window (the owner has many entries). */}
          <ScrollView style={styles.sideScroll} contentContainerStyle={[styles.sideItems, short && styles.sideItemsShort]}>
            {items.map((item) => (
              <SideItem key={item.key} item={item} active={isActive(item, pathname)} short={short} />
            ))}
          </ScrollView>
          <View style={styles.sideFooter}>
            <View>
              <AppText variant="bodyStrong" color="navInk" testID="signed-in-name" numberOfLines={1}>
                {user.name}
              </AppText>
              <AppText variant="small" color="navMuted" numberOfLines={1}>
                {ROLE_LABELS[user.role]} · {user.email}
              </AppText>
            </View>
            <SignOutButton onPress={signOut} onDark />
          </View>
        </View>
        <View style={styles.wideMain} {...landmark("main")}>
          <RedirectNoticeBar pathname={pathname} />
          {children}
        </View>
      </View>
    );
  }

  return (
    <View style={styles.narrowRoot} testID="app-shell-narrow">
      <TopBar name={user.name} onSignOut={signOut} />
      <View style={styles.narrowMain} {...landmark("main")}>
        <RedirectNoticeBar pathname={pathname} />
        {children}
      </View>
      <BottomTabs items={tabsFor(area, user.role).tabs} pathname={pathname} />
    </View>
  );
}

/** Below this window height the side navigation packs its entries closer (40 px each, still above WCAG 2.5.8's 24 px). */
const SHORT_WINDOW = 900;

function SideItem({ item, active, short }: { item: NavItem; active: boolean; short: boolean }) {
  return (
    <Link href={item.href} onPress={guardLinkPress} asChild>
      <LinkPressable
        accessibilityRole="link"
        aria-current={active ? "page" : undefined}
        testID={`nav-${item.key}`}
        style={short ? StyleSheet.flatten([styles.sideItem, styles.sideItemShort]) : styles.sideItem}
        highlighted={active}
        highlightStyle={{ backgroundColor: colors.navActive }}
      >
        <View style={[styles.sideMarker, active && { backgroundColor: colors.sageSoft }]} />
        <Feather name={item.icon} size={20} color={active ? colors.navInk : colors.navMuted} />
        <AppText variant="bodyStrong" color={active ? "navInk" : "navMuted"}>
          {item.label}
        </AppText>
      </LinkPressable>
    </Link>
  );
}

/** Why the person was sent to this page (a role gate turned them away), until they dismiss it or move on. */
function RedirectNoticeBar({ pathname }: { pathname: string }) {
  const message = useRedirectNotice(pathname);
  if (!message) return null;
  return (
    <View style={styles.redirectBar} accessibilityRole="alert" testID="redirect-notice">
      <Feather name="info" size={18} color={colors.crustInk} />
      <AppText variant="bodyStrong" color="crustInk" style={styles.redirectText}>
        {message}
      </AppText>
      <Pressable accessibilityRole="button" accessibilityLabel="Dismiss this message" onPress={clearRedirectNotice} style={styles.redirectDismiss} testID="redirect-notice-dismiss">
        <Feather name="x" size={18} color={colors.crustInk} />
      </Pressable>
    </View>
  );
}

function TopBar({ name, onSignOut }: { name: string; onSignOut: () => void }) {
  const insets = useSafeAreaInsets();
  return (
    <View style={[styles.topBar, { paddingTop: insets.top + space.sm }]}>
      <BrandMark size={26} />
      <View style={styles.topRight}>
        <AppText variant="small" color="muted" numberOfLines={1} style={styles.topName} testID="signed-in-name">
          {name}
        </AppText>
        <SignOutButton onPress={onSignOut} />
      </View>
    </View>
  );
}

/** "Sign out": light on the dark side navigation, crust-coloured in the top bar. */
function SignOutButton({ onPress, onDark }: { onPress: () => void; onDark?: boolean }) {
  const ink = onDark ? colors.navInk : colors.crust;
  return (
    <Pressable
      accessibilityRole="button"
      onPress={onPress}
      testID="sign-out"
      style={({ pressed }) => [onDark ? styles.sideSignOut : styles.topSignOut, pressed && { backgroundColor: onDark ? colors.navActive : colors.sunken }]}
    >
      <Feather name="log-out" size={onDark ? 18 : 16} color={ink} />
      <AppText variant="label" color={onDark ? "navInk" : "crust"}>
        Sign out
      </AppText>
    </Pressable>
  );
}

function BottomTabs({ items, pathname }: { items: NavItem[]; pathname: string }) {
  const insets = useSafeAreaInsets();
  return (
    <View style={[styles.tabBar, { paddingBottom: insets.bottom }]} {...landmark("navigation")} aria-label="Main">
      {items.map((item) => {
        const active = isActive(item, pathname);
        return (
          <Link key={item.key} href={item.href} onPress={guardLinkPress} asChild>
            <LinkPressable
              accessibilityRole="link"
              aria-current={active ? "page" : undefined}
              testID={`tab-${item.key}`}
              style={styles.tab}
              highlightStyle={{ backgroundColor: colors.rowHover }}
            >
              <View style={[styles.tabPill, active && styles.tabPillActive]}>
                <Feather name={item.icon} size={20} color={active ? colors.crustInk : colors.muted} />
              </View>
              <AppText variant="caption" color={active ? "crustInk" : "muted"} style={[styles.tabLabel, active && styles.tabLabelActive]}>
                {item.label}
              </AppText>
            </LinkPressable>
          </Link>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: "row", backgroundColor: colors.page },
  side: {
    width: layout.sideNavWidth,
    backgroundColor: colors.nav,
    paddingVertical: space.xl,
    paddingHorizontal: space.md,
    gap: space.xl,
  },
  sideShort: { paddingVertical: space.lg, gap: space.md },
  sideBrand: { paddingHorizontal: space.sm, gap: space.sm },
  sideScroll: { flex: 1, marginHorizontal: -space.xs },
  sideItems: { gap: space.xs, paddingHorizontal: space.xs },
  sideItemsShort: { gap: space.xxs },
  sideItem: {
    minHeight: layout.minTouch + 4,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    paddingRight: space.md,
    borderRadius: radii.md,
    overflow: "hidden",
  },
  sideItemShort: { minHeight: 40 },
  sideMarker: { width: 4, alignSelf: "stretch", borderRadius: 2, backgroundColor: "transparent", marginVertical: space.sm },
  sideFooter: { gap: space.md, paddingHorizontal: space.sm, paddingTop: space.lg, borderTopWidth: 1, borderTopColor: colors.navActive },
  sideSignOut: {
    minHeight: layout.minTouch,
    flexDirection: "row",
    alignItems: "center",
    gap: space.sm,
    paddingHorizontal: space.md,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.navMuted,
    alignSelf: "flex-start",
  },
  wideMain: { flex: 1 },
  redirectBar: { flexDirection: "row", alignItems: "center", gap: space.sm, backgroundColor: colors.crustSoft, paddingHorizontal: space.lg, paddingVertical: space.sm },
  redirectText: { flex: 1 },
  redirectDismiss: { minWidth: layout.minTouch, minHeight: layout.minTouch, alignItems: "center", justifyContent: "center", borderRadius: radii.pill },
  narrowRoot: { flex: 1, backgroundColor: colors.page },
  narrowMain: { flex: 1 },
  topBar: {
    flexDirection: "row",
    alignItems: "center",
    justifyContent: "space-between",
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingBottom: space.sm,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  topRight: { flexDirection: "row", alignItems: "center", gap: space.sm, flexShrink: 1 },
  topName: { flexShrink: 1, maxWidth: 150 },
  topSignOut: {
    minHeight: layout.minTouch,
    minWidth: layout.minTouch,
    flexDirection: "row",
    alignItems: "center",
    gap: space.xs,
    paddingHorizontal: space.sm,
    borderRadius: radii.pill,
  },
  tabBar: {
    flexDirection: "row",
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.border,
    minHeight: layout.tabBarHeight,
  },
  tab: { flex: 1, minHeight: layout.tabBarHeight, alignItems: "center", justifyContent: "center", gap: space.xxs, paddingVertical: space.xs },
  tabPill: { width: 52, height: 28, borderRadius: radii.pill, alignItems: "center", justifyContent: "center" },
  tabPillActive: { backgroundColor: colors.crustSoft },
  /** Two-word labels ("Standing order") wrap onto a second line, centered under the icon. */
  tabLabel: { textAlign: "center" },
  tabLabelActive: { fontFamily: "Nunito_800ExtraBold" },
});
