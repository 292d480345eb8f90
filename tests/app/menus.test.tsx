import { Dimensions } from "react-native";
import { screen, waitFor } from "expo-router/testing-library";
import { BAKER, BOOKKEEPER, BUYER, OWNER, mockApi, renderApp, sessionRoutes, signedInAs } from "./helpers";
import { navFor, tabsFor } from "../../components/shell/navItems";
import type { SessionUser } from "../../shared/schemas/auth";
import type { HomeArea } from "../../shared/roles";

// Issue 10, "Menus match their pages": a menu item's label is the name of the page it opens, read on that page
// as its title or the line above the title. Homes are the exception: they greet the person or name the day.
const HOMES = new Set(["/buyer", "/bake", "/office"]);

const PEOPLE: [HomeArea, SessionUser][] = [["buyer", BUYER], ["baker", BAKER], ["office", OWNER], ["office", BOOKKEEPER]];

const phone = { width: 390, height: 844, scale: 1, fontScale: 1 };
const original = Dimensions.get("window");
beforeEach(() => Dimensions.set({ window: phone, screen: phone }));
afterEach(() => Dimensions.set({ window: original, screen: original }));

const cases = PEOPLE.flatMap(([area, user]) => navFor(area, user.role).filter((i) => !HOMES.has(i.href)).map((item) => [user.role, item.label, item.href, area, user] as const));

describe("every menu item names the page it opens", () => {
  it.each(cases)("%s: %s → %s", async (_role, label, href, area, user) => {
    signedInAs(user);
    mockApi(sessionRoutes(user));
    renderApp(href);
    const inTabBar = tabsFor(area, user.role).tabs.some((t) => t.href === href);
    // The tab bar holds the label once when the item is a tab; the page must say it again.
    await waitFor(() => expect(screen.queryAllByText(label, { exact: true }).length).toBeGreaterThanOrEqual(inTabBar ? 2 : 1));
  });
});
