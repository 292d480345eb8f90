import sharp from "sharp";
import { BASE_URL, DESKTOP, PHONE, close, launch, newPage, shot, signIn } from "./browser";

/**
 * Issue 12: the buyer's and the office's day without a stumble, each numbered item as a person meets it at
 * 390 × 844 and 1280 × 800, asserting visible text and enabled state.
 */
jest.setTimeout(150_000);
beforeAll(() => launch());
afterAll(() => close());

describe("item 1: product photos", () => {
  it("the owner uploads a photo with progress; the buyer's order screen shows it as a small WebP", async () => {
    const office = await newPage(DESKTOP);
    const page = office.page;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(String(e)));
    await signIn(page, "owner@hollowbrook.test");
    await page.waitForURL((u) => u.pathname.startsWith("/office"));
    await page.goto(`${BASE_URL}/office/products`);
    await page.getByRole("row", { name: /^Pullman milk loaf, on offer/ }).first().click();
    await page.getByTestId("photo-card").waitFor();
    // A 2000 × 1500 photo, as a phone takes it (the server makes the sizes screens show).
    const photo = await sharp({ create: { width: 2000, height: 1500, channels: 3, background: "#c98d4a" } }).jpeg({ quality: 92 }).toBuffer();
    await page.getByTestId("photo-input").setInputFiles({ name: "pullman.jpg", mimeType: "image/jpeg", buffer: photo });
    await page.getByTestId("photo-done").filter({ hasText: "Photo saved" }).waitFor();
    const ownerImg = page.getByTestId("photo-card").locator('img[alt="Photo of Pullman milk loaf"]');
    await ownerImg.waitFor({ state: "attached" });
    await shot(page, "desktop-product-photo");
    await office.context.close();

    const buyer = await newPage(PHONE);
    const served: { url: string; status: number; type: string | null }[] = [];
    buyer.page.on("response", (r) => { if (r.url().includes("/api/uploads/")) served.push({ url: r.url(), status: r.status(), type: r.headers()["content-type"] ?? null }); });
    buyer.page.on("pageerror", (e) => errors.push(String(e)));
    await signIn(buyer.page, "buyer@tidewater.test");
    await buyer.page.getByTestId("next-cutoff-open").click();
    await buyer.page.getByTestId("order-submit").waitFor();
    const img = buyer.page.locator('img[alt="Photo of Pullman milk loaf"]').first();
    await img.waitFor({ state: "attached" });
    await buyer.page.waitForFunction((el) => (el as HTMLImageElement).complete && (el as HTMLImageElement).naturalWidth > 0, await img.elementHandle());
    // The tile (64 px) takes the 160 px size: sharp at 2×, a few kilobytes on a café's phone.
    expect(await img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(160);
    expect(await img.evaluate((el) => (el as HTMLImageElement).naturalHeight)).toBe(120);
    const tile = served.find((s) => s.url.endsWith(".webp"));
    expect(tile).toMatchObject({ status: 200, type: "image/webp" });
    await buyer.page.locator('img[alt="Photo of Pullman milk loaf"]').first().scrollIntoViewIfNeeded();
    await shot(buyer.page, "phone-order-with-photo");
    expect(errors).toEqual([]);
    await buyer.context.close();
  });
});
