import type { Page } from "playwright-core";
import { BASE_URL, DESKTOP, PHONE, close, launch, newPage, shot, signIn } from "./browser";

jest.setTimeout(120_000);
beforeAll(() => launch());
afterAll(() => close());

const STRIPE_URL = process.env.STRIPE_URL || "http://127.0.0.1:12111";
const tokenOf = (page: Page) => page.evaluate(() => JSON.parse(localStorage.getItem("panwise.session.v1") || "{}").token as string);

async function fillCard(page: Page, card: string) {
  await page.getByLabel("Card number").waitFor();
  // The page asks for an e-mail only when the session has none (Panwise sends the billing e-mail).
  if (await page.getByLabel("Email").count()) await page.getByLabel("Email").fill("accounts@tidewater.test");
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry date").fill("12/30");
  await page.getByLabel("Security code (CVC)").fill("123");
  await page.getByLabel("Name on card").fill("Marisol Okafor");
  await page.getByRole("button", { name: /^Pay / }).click();
}

describe("a buyer pays an open invoice by card (Stripe's hosted page, the local fake)", () => {
  it("a declined card shows the bank's answer in our words; the test card 4242 pays and the invoice shows paid", async () => {
    const { context, page } = await newPage(PHONE);
    await signIn(page, "buyer@tidewater.test");
    await page.getByTestId("buyer-home-title").waitFor();
    const token = await tokenOf(page);
    const list = (await (await fetch(`${BASE_URL}/api/invoices?status=open`, { headers: { Authorization: `Bearer ${token}` } })).json()) as { invoices: { id: number; number: string; amountDueCents: number }[] };
    const open = list.invoices.find((i) => i.amountDueCents > 0)!;
    expect(open).toBeDefined();
    await page.getByTestId("tab-invoices").click();
    await page.getByTestId(`invoice-row-${open.id}`).click();
    await page.getByTestId("pay-by-card").waitFor();
    await shot(page, "phone-invoice-unpaid");
    await page.getByTestId("pay-by-card").click();
    await page.waitForURL((u) => u.href.startsWith(`${STRIPE_URL}/pay/`));

    await fillCard(page, "4000 0000 0000 0002");
    // The decline in Panwise's words (fakes/stripe/pages.ts DECLINE_WORDS), never Stripe's sentence.
    await page.getByText("The card's bank turned this payment down without saying why.", { exact: false }).waitFor();
    await shot(page, "phone-hosted-page-declined");

    await fillCard(page, "4242 4242 4242 4242");
    await page.waitForURL((u) => u.href.startsWith(`${BASE_URL}/pay/return`));
    await page.getByTestId("pay-paid").waitFor({ timeout: 30_000 });
    await shot(page, "phone-invoice-paid");
    const after = (await (await fetch(`${BASE_URL}/api/invoices/${open.id}`, { headers: { Authorization: `Bearer ${token}` } })).json()) as { invoice: { status: string; amountDueCents: number }; payments: { method: string }[] };
    expect(after.invoice).toMatchObject({ status: "paid", amountDueCents: 0 });
    expect(after.payments.filter((p) => p.method === "card")).toHaveLength(1);
    await context.close();
  });
});

describe("the bookkeeper at desktop width", () => {
  it("triggers a payout on the fake, reconciles it, and exports the CSVs", async () => {
    const fake = (await (await fetch(`${STRIPE_URL}/_fake/payouts/run`, { method: "POST" })).json()) as { payout: { id: string } | null };
    const { context, page } = await newPage(DESKTOP);
    await signIn(page, "books@hollowbrook.test");
    await page.getByTestId("office-home-title").waitFor();
    const token = await tokenOf(page);
    const payouts = (await (await fetch(`${BASE_URL}/api/payouts`, { headers: { Authorization: `Bearer ${token}` } })).json()) as { payouts: { id: string; reconciledAt: string | null }[] };
    const target = fake.payout?.id ?? payouts.payouts.find((p) => !p.reconciledAt)!.id;
    await page.getByTestId("nav-money").click();
    await page.getByTestId("money-payouts").click();
    await page.getByTestId(`payout-row-${target}`).click();
    await page.getByTestId("reconcile").waitFor();
    await shot(page, "desktop-payout-detail");
    await page.getByTestId("reconcile-note").fill("Matches the bank statement");
    await page.getByTestId("reconcile").click();
    await page.getByTestId("payout-reconciled-by").waitFor();
    await shot(page, "desktop-payout-reconciled");

    await page.goto(`${BASE_URL}/office/money/exports`);
    for (const kind of ["invoices", "payments", "payouts"]) {
      const download = page.waitForEvent("download");
      await page.getByTestId(`export-${kind}`).click();
      const file = await download;
      expect(file.suggestedFilename()).toMatch(new RegExp(`^${kind}.*\\.csv$`));
      const text = await (await fetch(`${BASE_URL}/api/reports/exports/${kind}.csv`, { headers: { Authorization: `Bearer ${token}` } })).text();
      expect(text.split("\n")[0]).toContain(kind === "payouts" ? "Bank Payout Ref" : kind === "payments" ? "Received On" : "Invoice Number");
    }
    await page.goto(`${BASE_URL}/office/invoices`);
    await page.getByText(/HB-2026-/).first().waitFor();
    await shot(page, "desktop-invoices");
    await page.goto(`${BASE_URL}/office/money/aging`);
    await page.getByText("North Pier Coffee").first().waitFor();
    await shot(page, "desktop-aging");
    await context.close();
  });
});
