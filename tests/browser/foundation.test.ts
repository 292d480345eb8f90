import type { Page } from "playwright-core";
import { BASE_URL, DESKTOP, PHONE, close, latestMailTo, launch, newPage, shot, signIn } from "./browser";

jest.setTimeout(120_000);
beforeAll(() => launch());
afterAll(() => close());

const homes = [
  { email: "owner@hollowbrook.test", path: "/office", title: "office-home-title", text: "Office" },
  { email: "books@hollowbrook.test", path: "/office", title: "office-home-title", text: "Office" },
  { email: "baker@hollowbrook.test", path: "/bake", title: "baker-home-title", text: "Bake day" },
  { email: "buyer@tidewater.test", path: "/buyer", title: "buyer-home-title", text: "Tidewater Café" },
  { email: "buyer@junipertable.test", path: "/buyer", title: "buyer-home-title", text: "Juniper Table" },
  { email: "buyer@northpier.test", path: "/buyer", title: "buyer-home-title", text: "North Pier Coffee" },
];

async function expectHome(page: Page, path: string, testId: string, text: string) {
  await page.waitForURL((u) => u.pathname === path);
  const title = page.getByTestId(testId);
  await title.waitFor();
  expect(await title.textContent()).toContain(text);
}

describe("at phone size (390×844)", () => {
  it.each(homes)("$email signs in and lands on their home", async ({ email, path, title, text }) => {
    const { context, page } = await newPage(PHONE);
    await signIn(page, email);
    await expectHome(page, path, title, text);
    // Phone layout: a bottom tab bar, no side navigation.
    expect(await page.getByRole("navigation", { name: "Main" }).count()).toBeGreaterThan(0);
    await shot(page, `phone-home-${email.split("@")[0]}-${email.split("@")[1].split(".")[0]}`);
    // The session survives a reload; sign-out clears it.
    await page.reload();
    await expectHome(page, path, title, text);
    await page.getByRole("button", { name: "Sign out" }).first().click();
    await page.waitForURL((u) => u.pathname === "/sign-in");
    expect(await page.evaluate(() => localStorage.getItem("panwise.session.v1"))).toBeNull();
    await context.close();
  });

  it("a wrong password shows the error at the top of the form", async () => {
    const { context, page } = await newPage(PHONE);
    await signIn(page, "owner@hollowbrook.test", "not-the-password");
    const error = page.getByTestId("sign-in-error");
    await error.waitFor();
    expect(await error.textContent()).toMatch(/don't match a sign-in/);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await shot(page, "phone-sign-in-wrong-password");
    await context.close();
  });

  it("a buyer sent to an office page is taken back to their own home", async () => {
    const { context, page } = await newPage(PHONE);
    await signIn(page, "buyer@tidewater.test");
    await expectHome(page, "/buyer", "buyer-home-title", "Tidewater Café");
    await page.goto(`${BASE_URL}/office/people`);
    await expectHome(page, "/buyer", "buyer-home-title", "Tidewater Café");
    await context.close();
  });

  it("the owner invites a buyer; the mailed link sets a password and the new buyer signs in", async () => {
    const email = `new.buyer.${Date.now()}@tidewater.test`;
    const owner = await newPage(PHONE);
    await signIn(owner.page, "owner@hollowbrook.test");
    await expectHome(owner.page, "/office", "office-home-title", "Office");
    await owner.page.goto(`${BASE_URL}/office/people/invite`);
    await owner.page.getByLabel("E-mail").fill(email);
    await owner.page.getByTestId("invite-role-buyer").click();
    const tidewater = owner.page.locator('[data-testid^="invite-account-"]', { hasText: "Tidewater Café" });
    await tidewater.click();
    await shot(owner.page, "phone-invite-form");
    await owner.page.getByRole("button", { name: "Send invitation" }).click();
    await owner.page.getByTestId("invited-notice").waitFor();
    await owner.context.close();

    const mail = await latestMailTo(email);
    expect(mail.subject).toContain("Hollowbrook Bakehouse");
    const link = /(https?:\/\/\S+\/set-password\?\S+)/.exec(mail.text)![1];
    expect(link.startsWith(BASE_URL)).toBe(true);

    const invitee = await newPage(PHONE);
    await invitee.page.goto(link);
    await invitee.page.getByTestId("invitation-for").waitFor();
    await invitee.page.getByLabel("Your name").fill("Sam Newcomer");
    await invitee.page.getByLabel("New password", { exact: true }).fill("fresh-rolls-2026");
    await invitee.page.getByLabel("Confirm new password").fill("fresh-rolls-2026");
    await shot(invitee.page, "phone-set-password");
    await invitee.page.getByRole("button", { name: "Create my sign-in" }).click();
    await expectHome(invitee.page, "/buyer", "buyer-home-title", "Tidewater Café");
    await invitee.page.getByRole("button", { name: "Sign out" }).first().click();
    await invitee.page.waitForURL((u) => u.pathname === "/sign-in");
    await signIn(invitee.page, email, "fresh-rolls-2026");
    await expectHome(invitee.page, "/buyer", "buyer-home-title", "Tidewater Café");
    // The link works once.
    await invitee.page.getByRole("button", { name: "Sign out" }).first().click();
    await invitee.page.goto(link);
    await invitee.page.getByTestId("set-password-link-error").waitFor();
    await invitee.context.close();
  });
});

describe("at desktop width (1280×800)", () => {
  it("the office screens: home, people and accounts, with side navigation", async () => {
    const { context, page } = await newPage(DESKTOP);
    await signIn(page, "owner@hollowbrook.test");
    await expectHome(page, "/office", "office-home-title", "Office");
    await page.getByTestId("nav-people").waitFor();
    await shot(page, "desktop-office-home");
    await page.getByTestId("nav-people").click();
    await page.waitForURL((u) => u.pathname === "/office/people");
    await page.getByText("baker@hollowbrook.test").first().waitFor();
    await shot(page, "desktop-office-people");
    await page.getByTestId("nav-accounts").click();
    await page.waitForURL((u) => u.pathname === "/office/accounts");
    await page.getByText("North Pier Coffee").first().waitFor();
    await page.getByLabel("Search accounts").fill("juniper");
    await page.getByText("Tidewater Café").waitFor({ state: "detached" });
    expect(await page.getByText("Juniper Table").count()).toBeGreaterThan(0);
    await shot(page, "desktop-office-accounts-search");
    await page.getByText("Juniper Table").first().click();
    await page.getByTestId("account-title").waitFor();
    expect(await page.getByTestId("account-title").textContent()).toContain("Juniper Table");
    await shot(page, "desktop-office-account-detail");
    await context.close();
  });

  it("the bookkeeper sees accounts but not people", async () => {
    const { context, page } = await newPage(DESKTOP);
    await signIn(page, "books@hollowbrook.test");
    await expectHome(page, "/office", "office-home-title", "Office");
    await page.getByTestId("nav-accounts").waitFor();
    expect(await page.getByTestId("nav-people").count()).toBe(0);
    await page.goto(`${BASE_URL}/office/people`);
    await expectHome(page, "/office", "office-home-title", "Office");
    await context.close();
  });
});
