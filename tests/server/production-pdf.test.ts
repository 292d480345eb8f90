import { spawnSync } from "node:child_process";
import path from "node:path";
import { startTestApp, auth, type TestApp } from "./helpers/app";
import { seedDemo } from "../../server/seed/demo";
import { computePlan } from "../../server/production/plan.service";
import { renderPlanPdf } from "../../server/production/plan.pdf";
import { renderInvoicePdf } from "../../server/billing/invoice.pdf";
import { pdfText } from "../../server/pdf/fonts";
import { Product } from "../../server/catalog/product.entity";
import { Formula } from "../../server/production/formula.entity";
import { User } from "../../server/users/user.entity";
import { hashPassword } from "../../server/auth/password-hash";
import { TEST_PASSWORD, tokenFor } from "./helpers/app";
import { dayCautions } from "../../shared/cautions";
import type { PlanDto } from "../../shared/schemas/production";

/**
 * The production PDFs, rendered from the seeded demo (not fixtures) and from the same day with long names, read
 * back with a PDF text extractor (Mozilla PDF.js, pdfjs-dist) to check where every line of text landed.
 */
const NOW = "2026-12-02T15:00:00Z"; // Wed 2 Dec 2026, 09:00 in Chicago
const DATES = ["2026-12-03", "2026-12-04", "2026-12-05"]; // Thu, Fri, Sat: every demo dough and product between them
let t: TestApp;

interface Page { width: number; height: number; items: { str: string; x: number; y: number; w: number; h: number }[] }
function extract(pdf: Buffer): Page[] {
  const out = spawnSync(process.execPath, [path.join(__dirname, "helpers", "pdf-text.mjs")], { input: pdf, maxBuffer: 64 * 1024 * 1024 });
  if (out.status !== 0) throw new Error(`pdf-text failed: ${out.stderr.toString()}`);
  return JSON.parse(out.stdout.toString()) as Page[];
}
const textOf = (pages: Page[]) => pages.map((p) => p.items.map((i) => i.str).join("\n")).join("\n");

/** Every positioned text item starts at or after the left margin and ends at or before the right one (0.5 pt slack). */
function overflows(pages: Page[], margin = 40): string[] {
  const bad: string[] = [];
  pages.forEach((p, n) => {
    for (const i of p.items) {
      if (i.x + i.w > p.width - margin + 0.5 || i.x < margin - 0.5) bad.push(`page ${n + 1}: "${i.str}" x ${i.x.toFixed(1)}–${(i.x + i.w).toFixed(1)} (page ${p.width})`);
      if (i.y < margin - 12 || i.y > p.height - margin + 2) bad.push(`page ${n + 1}: "${i.str}" at y ${i.y.toFixed(1)} outside the top or bottom margin`);
    }
  });
  return bad;
}

const plans: Record<string, PlanDto> = {};
beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await seedDemo(t.ds);
  for (const d of DATES) plans[d] = await computePlan(t.ctx, d, { includeStanding: true });
}, 60_000); // the whole demo seeded and three plans computed: seconds on a busy machine
afterAll(() => t.close());

const render = (plan: PlanDto, units: "metric" | "us", bakeryName = "Hollowbrook Bakehouse") => renderPlanPdf({ ...plan, bakeryName, timeZone: "America/Chicago" }, units);

describe("the demo's own numbers", () => {
  it("milk bread's effective hydration is ≈ 60.4 % by the usual convention, the flour's moisture apart", async () => {
    // Water in the liquids, egg, butter (USDA FoodData Central water fractions, from memory: whole milk ≈ 88 %,
    // unsalted butter ≈ 18 %, whole egg ≈ 76 %) over the flour: 58 × 0.88 + 10 × 0.76 + 10 × 0.18 = 60.44 %.
    const baker = await t.ds.getRepository(User).save(t.ds.getRepository(User).create({ email: "pdf-baker@hollowbrook.test", name: "PDF baker", role: "baker", passwordHash: await hashPassword(TEST_PASSWORD), disabled: false, accountId: null }));
    const res = await t.http().get("/api/formulas").set(auth(await tokenFor(t, baker)));
    expect(res.status).toBe(200);
    const milk = res.body.formulas.find((f: { name: string }) => f.name === "Milk bread");
    const pct = (id: string) => milk.lines.find((l: { name: string }) => l.name === id).percent as number;
    expect([pct("Whole milk"), pct("Whole egg"), pct("Unsalted butter")]).toEqual([58, 10, 10]);
    expect(milk.figures.effectiveHydrationPercent).toBeCloseTo(60.44, 2);
    expect(milk.figures.flourMoisturePercent).toBeCloseTo(12, 6);
  });

  it("cautions name the day's allergens by product, the formula's own cook-to temperature, and end with the deferral", () => {
    const sat = plans["2026-12-05"];
    const metric = dayCautions(sat, "metric");
    const allergens = metric.find((c) => c.key === "allergens")!.text;
    expect(allergens).toMatch(/Sesame \([^)]*Sesame brioche buns[^)]*\)/);
    // Honey-oat rolls carry no egg of their own (the demo's honey-oat dough has none).
    expect(allergens).toMatch(/Egg \((?![^)]*Honey-oat rolls)[^)]*\)/);
    expect(metric.find((c) => c.key.startsWith("paste-") && c.title.includes("Milk bread"))!.text).toMatch(/cooked to 65 °C/);
    // The demo's egg washes are components made with whole egg: named as raw egg, kept at 5 °C (FDA Food Code 3-501.16).
    expect(metric.find((c) => c.key === "egg-wash")!.text).toMatch(/^Egg wash is made with raw egg: keep it at 5 °C or below/);
    // The heaviest mix is over 10 kg: the lifting caution names it, and the 23 kg NIOSH load constant for the sacks.
    expect(metric.find((c) => c.key === "lifting")!.text).toMatch(/heaviest dough today is Milk bread, mix 1, at 1\d\.\d{3} kg.*25 kg, more than the 23 kg/);
    expect(metric.find((c) => c.key === "internal")!.text).toMatch(/record the reading.*Milk bread is done at 89 °C/);
    expect(metric[metric.length - 1]).toMatchObject({ key: "deferral", text: expect.stringMatching(/local food-safety code, licensed practice/) });
    const us = dayCautions(sat, "us");
    expect(us.find((c) => c.key === "paste-ahead")!.text).toMatch(/from 135 °F to 70 °F within 2 hours and to 41 °F or below within 6 hours/);
    expect(us.map((c) => c.text).join(" ")).not.toMatch(/°C|\bkg\b/);
  });
});

describe("production PDFs fit the page (checked on the extracted text positions)", () => {
  it("the check itself catches a line that runs past the right margin", async () => {
    const PDFDocument = (await import("pdfkit")).default;
    const doc = new PDFDocument({ size: "LETTER", margin: 40 });
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    const done = new Promise<Buffer>((r) => doc.on("end", () => r(Buffer.concat(chunks))));
    doc.text("Fits inside the margins", 40, 40);
    doc.text("Starts near the right edge and runs off it", 500, 80, { lineBreak: false });
    doc.end();
    expect(overflows(extract(await done))).toEqual([expect.stringMatching(/"Starts near the right/)]);
  });

  it.each(DATES.flatMap((d) => [[d, "metric"], [d, "us"]] as const))("demo %s in %s units", async (date, units) => {
    const pages = extract(await render(plans[date], units));
    expect(pages.length).toBeGreaterThan(1 + plans[date].doughs.length - 1);
    expect(overflows(pages)).toEqual([]);
    const text = textOf(pages);
    expect(text).not.toMatch(/\b1 pans\b|\b1 pieces\b/);
    expect(text).toMatch(/Reminders only: follow your local food-safety code/);
    if (units === "us") {
      // US units everywhere: no grams, kilograms or °C; ounces always carried into pounds.
      expect(text).not.toMatch(/°C|\d kg\b|\d g\b/);
      expect(text).not.toMatch(/\d+ lb 1[6-9](\.\d+)? oz/);
      expect(text).toMatch(/largest mixer 44 lb/);
      expect(text).toMatch(/pieces of \d+(\.\d)? oz scaled dough/);
    } else {
      expect(text).not.toMatch(/°F|\d oz\b/);
      expect(text).not.toMatch(/\d+\.\d{1,2} kg/); // 1 g resolution: three decimals in kg
      expect(text).toMatch(/largest mixer 20 kg/);
    }
  });

  it("a day with long product, formula and bakery names still fits in both unit systems", async () => {
    // With characters outside WinAnsi, which the built-in Helvetica drew wider than measured: "−" (U+2212) and "→"
    // (Nunito has no arrow: written "->").
    const long = "Extraordinarily-long-named sesame-and-black-onion-seed brioche burger buns − harbourside group → 8 per pack ≥ 90 g";
    const longFormula = "Milk bread (Hokkaido style, tangzhong), the bakery's house recipe for every soft roll, bun and sandwich loaf";
    await t.ds.getRepository(Product).update({ name: "Sesame brioche buns" }, { name: long.slice(0, 120) });
    await t.ds.getRepository(Formula).update({ name: "Milk bread" }, { name: longFormula.slice(0, 120) });
    const plan = await computePlan(t.ctx, "2026-12-05", { includeStanding: true });
    expect(plan.products.some((p) => p.name.startsWith("Extraordinarily"))).toBe(true);
    for (const units of ["metric", "us"] as const) {
      const pages = extract(await render(plan, units, "The Hollowbrook Bakehouse and Harbourside Wholesale Kitchen, Incorporated"));
      expect(overflows(pages)).toEqual([]);
      expect(textOf(pages)).toMatch(/Extraordinarily/);
    }
  });

  it("the invoice PDF fits too, with long product, account and bakery texts", async () => {
    const long = "Extraordinarily-long-named sesame-and-black-onion-seed brioche burger buns for the harbourside restaurant group, pack of 8";
    const detail = {
      invoice: { number: "HB-2026-000123", kind: "statement", issueDate: "2026-12-01", dueDate: "2026-12-31", periodStart: "2026-11-01", periodEnd: "2026-11-30", currency: "USD", subtotalCents: 123456789, taxExempt: false, taxRateBp: 825, taxCents: 10185185, totalCents: 133641974, paidCents: 100000, refundedCents: 0, amountDueCents: 133541974 },
      lines: Array.from({ length: 40 }, (_, i) => ({ deliveryDate: "2026-11-02", description: i % 3 ? "Milk-bread dinner rolls, tray of 15" : long, quantity: 1200 + i, unitPriceCents: 1999, amountCents: 2398800 })),
      creditNotes: [{ number: "CN-2026-000001", reason: "Two trays arrived crushed on the 14th; the driver confirmed it at the door and the café kept the rest of the order", totalCents: 3600 }],
    };
    const bakery = { name: "The Hollowbrook Bakehouse and Harbourside Wholesale Kitchen, Incorporated", address: "Unit 14, The Old Granary Buildings, 1200 North Harbourside Industrial Estate Road, Hollowbrook, WI 53000", phone: "+1 414 555 0100", email: "accounts-receivable-and-wholesale@hollowbrook-bakehouse.test", paymentInstructions: "Bank transfer to Hollowbrook Community Credit Union, routing 000000000, account 0000000000000, quoting the invoice number and the account name exactly as printed above" };
    const account = { businessName: "Juniper Table Restaurant Group and Harbourside Events Catering Company", deliveryAddress: "The loading bay behind 42 Juniper Street, past the blue door, ring twice", billingEmail: "accounts.payable.department@junipertable-restaurant-group.test", paymentTerms: "net30" };
    const pdf = await renderInvoicePdf({ ...detail, bakery, account } as unknown as Parameters<typeof renderInvoicePdf>[0]);
    const pages = extract(pdf);
    expect(textOf(pages)).toMatch(/Extraordinarily/);
    expect(overflows(pages, 48)).toEqual([]);
  });

  it("the sheet is served as a PDF through the API in either system", async () => {
    const baker = await t.ds.getRepository(User).findOneByOrFail({ email: "baker@hollowbrook.test" });
    await t.ds.getRepository(User).update({ id: baker.id }, { passwordHash: await hashPassword(TEST_PASSWORD) });
    const token = await tokenFor(t, baker);
    const res = await t.http().get("/api/production/plan.pdf").query({ date: "2026-12-05", units: "us" }).set(auth(token)).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/application\/pdf/);
    expect(overflows(extract(res.body as Buffer))).toEqual([]);
  });
});

describe("the PDFs are set in the app's Nunito (server/pdf/fonts.ts)", () => {
  /** The fonts a PDF names (/BaseFont), subset prefixes ("ABCDEF+") dropped. */
  const baseFonts = (pdf: Buffer) => [...new Set([...pdf.toString("latin1").matchAll(/\/BaseFont\s*\/(?:[A-Z]{6}\+)?([A-Za-z0-9-]+)/g)].map((m) => m[1]))].sort();

  it("a plan prints \"Łódź\" and \"≤\" exactly, and embeds Nunito only", async () => {
    const before = await computePlan(t.ctx, "2026-12-05", { includeStanding: true });
    await t.ds.getRepository(Product).update({ id: before.products[0].productId }, { name: "Łódź rye rolls ≤ 90 g" });
    const plan = await computePlan(t.ctx, "2026-12-05", { includeStanding: true });
    const pdf = await render(plan, "metric", "Piekarnia Łódź");
    const pages = extract(pdf);
    const items = pages.flatMap((p) => p.items.map((i) => i.str));
    expect(items).toContain("Łódź rye rolls ≤ 90 g");
    expect(items).toContain("PIEKARNIA ŁÓDŹ");
    expect(overflows(pages)).toEqual([]);
    expect(baseFonts(pdf)).toEqual(["Nunito-Bold", "Nunito-Regular"]);
  });

  it("an invoice prints them too, with money and dates from shared/format.ts", async () => {
    const detail = {
      invoice: { number: "HB-2026-000124", kind: "invoice", issueDate: "2026-12-01", dueDate: "2026-12-31", periodStart: null, periodEnd: null, currency: "USD", subtotalCents: 180000, taxExempt: false, taxRateBp: 875, taxCents: 15750, totalCents: 195750, paidCents: 0, refundedCents: 0, amountDueCents: 195750 },
      lines: [{ deliveryDate: "2026-11-30", description: "Łódź rye rolls ≤ 90 g, tray of 15", quantity: 1000, unitPriceCents: 180, amountCents: 180000 }],
      creditNotes: [],
    };
    const bakery = { name: "Piekarnia Łódź", address: "ul. Piotrkowska 1, Łódź", phone: "", email: "hi@lodz.test", paymentInstructions: "", locale: "en-US", timeZone: "America/Chicago" };
    const account = { businessName: "Café Źródło", deliveryAddress: "2 Żeromskiego St", billingEmail: "ap@zrodlo.test", paymentTerms: "net30" };
    const pdf = await renderInvoicePdf({ ...detail, bakery, account } as unknown as Parameters<typeof renderInvoicePdf>[0]);
    const items = extract(pdf).flatMap((p) => p.items.map((i) => i.str));
    for (const s of ["Piekarnia Łódź", "ul. Piotrkowska 1, Łódź", "Café Źródło", "Łódź rye rolls ≤ 90 g, tray of 15", "1,000", "$1.80", "$1,957.50", "Issued: Dec 1, 2026", "Due: Dec 31, 2026"]) expect(items).toContain(s);
    expect(baseFonts(pdf)).toEqual(["Nunito-Bold", "Nunito-Regular"]);
  });

  it("writes the two characters Nunito lacks with ones it has", () => {
    expect(pdfText("6:00\u202FAM → oven ≤ 230 °C − 5")).toBe("6:00\u00A0AM -> oven ≤ 230 °C − 5");
  });
});
