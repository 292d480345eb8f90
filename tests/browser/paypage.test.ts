import type { Page } from "playwright-core";
import { BASE_URL, PHONE, close, launch, newPage, shot, signIn } from "./browser";

/**
 * Issue 10 item 1: the local payment page (fakes/stripe) at 390 px speaks Panwise's words: the test banner,
 * the invoice and the payee in the heading, our own field errors and our own decline sentence.
 * It never pays, so the billing journey that pays an open invoice is not affected.
 */

jest.setTimeout(120_000);
beforeAll(() => launch());
afterAll(() => close());

const STRIPE_URL = process.env.STRIPE_URL || "http://127.0.0.1:12111";
const tokenOf = (page: Page) => page.evaluate(() => JSON.parse(localStorage.getItem("panwise.session.v1") || "{}").token as string);

async function submit(page: Page, card: { number: string; expiry: string; cvc?: string }) {
  if (await page.getByLabel("Email").count()) await page.getByLabel("Email").fill("accounts@northpier.test");
  await page.getByLabel("Card number").fill(card.number);
  await page.getByLabel("Expiry date").fill(card.expiry);
  await page.getByLabel("Security code (CVC)").fill(card.cvc ?? "123");
  await page.getByLabel("Name on card").fill("Dana Whitlock");
  await page.getByRole("button", { name: /^Pay / }).click();
  await page.getByRole("alert").waitFor();
}

/** Nothing wider than the phone: no sideways scrolling at 390 px (WCAG 2.1 SC 1.4.10 Reflow). */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe("the local payment page at 390 px", () => {
  it("shows the test banner, the invoice and the bakery, our field errors and our decline sentence", async () => {
    const { context, page } = await newPage(PHONE);
    await signIn(page, "buyer@northpier.test");
    await page.getByTestId("buyer-home-title").waitFor();
    const token = await tokenOf(page);
    const headers = { Authorization: `Bearer ${token}` };
    const list = (await (await fetch(`${BASE_URL}/api/invoices?status=open`, { headers })).json()) as { invoices: { id: number; number: string; amountDueCents: number }[] };
    const open = list.invoices.find((i) => i.amountDueCents > 0);
    expect(open).toBeDefined();
    const checkout = await fetch(`${BASE_URL}/api/invoices/${open!.id}/checkout`, { method: "POST", headers });
    expect(checkout.status).toBeLessThan(300);
    const { url } = (await checkout.json()) as { url: string };
    expect(url.startsWith(`${STRIPE_URL}/pay/`)).toBe(true);
    await page.goto(url);

    // The banner says what this page is; the heading names what is paid and to whom (the demo bakery).
    await page.getByText("Panwise local test payment page — no money moves.").waitFor();
    await page.getByRole("heading", { level: 1, name: `Invoice ${open!.number} — Hollowbrook Bakehouse` }).waitFor();
    expect(await page.locator("input[placeholder]").count()).toBe(0);
    expect(await page.getByText(/checkout session/i).count()).toBe(0);
    expect(await fitsWidth(page)).toBe(true);
    await shot(page, "phone-paypage");

    // A short card number and a past expiry: our own field errors, each tied to its field.
    await submit(page, { number: "4242 4242", expiry: "01/20" });
    await page.locator("#f-card_number-error").getByText("The card number is too short — check the digits.").waitFor();
    await page.locator("#f-expiry-error").getByText("This card ran out at the end of 01/2020 — use a card that is still valid.").waitFor();
    expect(await page.getByLabel("Card number").getAttribute("aria-invalid")).toBe("true");
    expect(await page.getByText(/^Your card/).count()).toBe(0);
    expect(await fitsWidth(page)).toBe(true);
    await shot(page, "phone-paypage-field-errors");

    // Stripe's declining test card 4000 0000 0000 0002 (generic_decline): our sentence, not Stripe's.
    await submit(page, { number: "4000 0000 0000 0002", expiry: "12/30" });
    await page.getByText("The payment did not go through").waitFor();
    await page.getByText("The card's bank turned this payment down without saying why. Nothing was taken.", { exact: false }).waitFor();
    expect(await page.getByText("Your card was declined.").count()).toBe(0);
    expect(await fitsWidth(page)).toBe(true);
    await shot(page, "phone-paypage-declined");
    await context.close();
  });
});
