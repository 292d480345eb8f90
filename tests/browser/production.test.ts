import { BASE_URL, DESKTOP, PHONE, close, launch, newPage, shot, signIn } from "./browser";

jest.setTimeout(120_000);
beforeAll(() => launch());
afterAll(() => close());

/** The demo's next bake day has locked orders (seeded history), so the plan is full and final. */
describe("the baker's next bake day", () => {
  it.each([["phone", PHONE], ["desktop", DESKTOP]] as const)("shows a full plan at %s width", async (name, viewport) => {
    const { context, page } = await newPage(viewport);
    await signIn(page, "baker@hollowbrook.test");
    await page.getByTestId("baker-home-title").waitFor();
    expect(await page.getByTestId("baker-home-title").textContent()).toContain("Bake day");
    // Pans per product, a mix card with paste and final mix, liquid temperature, the timeline.
    const pans = page.locator('[data-testid^="pans-"][data-testid$="-count"]').first();
    await pans.waitFor();
    expect(Number(await pans.textContent())).toBeGreaterThan(0);
    const mix = page.locator('[data-testid^="mix-"][data-testid$="-liquid"]').first();
    await mix.waitFor();
    expect(await mix.textContent()).toMatch(/°C/);
    await page.getByTestId("timeline").waitFor();
    await shot(page, `${name}-bake-day`);

    // Switch to pounds, ounces and °F.
    await page.getByTestId("units-us").click();
    await page.locator('[data-testid^="mix-"][data-testid$="-liquid"]').first().filter({ hasText: "°F" }).waitFor();
    expect(await page.locator('[data-testid^="mix-"]').filter({ hasText: / oz/ }).count()).toBeGreaterThan(0);
    await shot(page, `${name}-bake-day-us`);
    await page.getByTestId("units-metric").click();

    // Tick the first mix off as weighed and mixed; the server keeps it.
    const tick = page.locator('[data-testid^="mix-"][data-testid$="-done"]').first();
    const id = (await tick.getAttribute("data-testid"))!.replace(/-done$/, "");
    await tick.click();
    await page.getByTestId(`${id}-done-badge`).waitFor();
    await page.reload();
    await page.getByTestId(`${id}-done-badge`).waitFor();
    await page.getByTestId(`${id}-done`).click(); // untick for the next run
    await page.getByTestId(`${id}-done-badge`).waitFor({ state: "detached" });
    await context.close();
  });

  it("serves the production sheet as a PDF", async () => {
    const { context, page } = await newPage(DESKTOP);
    await signIn(page, "baker@hollowbrook.test");
    await page.getByTestId("baker-home-title").waitFor();
    const token = await page.evaluate(() => JSON.parse(localStorage.getItem("panwise.session.v1") || "{}").token as string);
    const next = (await (await fetch(`${BASE_URL}/api/production/next-day`, { headers: { Authorization: `Bearer ${token}` } })).json()) as { date: string };
    const download = page.waitForEvent("download");
    await page.getByTestId("pdf-metric").click();
    const file = await download;
    expect(file.suggestedFilename()).toBe(`production-${next.date}.pdf`);
    const res = await fetch(`${BASE_URL}/api/production/plan.pdf?date=${next.date}`, { headers: { Authorization: `Bearer ${token}` } });
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(Buffer.from(await res.arrayBuffer()).subarray(0, 5).toString()).toBe("%PDF-");
    await context.close();
  });
});
