import type { DataSource } from "typeorm";
import { Bakery } from "../bakery/bakery.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { hashPassword } from "../auth/auth.service";
import type { Role } from "../../shared/roles";
import { Product } from "../catalog/product.entity";
import { PriceList } from "../catalog/price-list.entity";
import { PriceListItem } from "../catalog/price-list-item.entity";
import { BakeryClosure } from "../calendar/closure.entity";
import { StandingOrder } from "../orders/standing-order.entity";
import { StandingOrderLine } from "../orders/standing-order-line.entity";
import { OrderLine } from "../orders/order-line.entity";
import { weeklyRule } from "../../shared/recurrence";
import type { Weekday } from "../../shared/calendar";
import { BakehouseMixer } from "../production/bakehouse-mixer.entity";
import { BakehouseOven } from "../production/bakehouse-oven.entity";
import { Formula } from "../production/formula.entity";
import { FormulaVersion } from "../production/formula-version.entity";
import { Ingredient } from "../production/ingredient.entity";
import { ProductionSettings } from "../production/production-settings.entity";
import type { StepSpec } from "../../shared/production";
import { ProductComponent } from "../catalog/product-component.entity";
import type { ComponentKind, ComponentPer } from "../../shared/components";

/** The invented demo scenario: the Hollowbrook Bakehouse and three wholesale customers. */
export const DEMO_PASSWORD = "panwise-demo";

/**
 * Every demo address is a made-up street in the made-up town of Hollowbrook with ZIP 00000, which belongs to no
 * place (from memory: the lowest ZIP Code the USPS has issued is 00501), so no one can take it for a real address.
 */
export const DEMO_BAKERY = {
  name: "Hollowbrook Bakehouse",
  timeZone: "America/Chicago",
  currency: "USD",
  // The demo bakery is American: dates, times and amounts in US English (shared/format.ts).
  locale: "en-US",
  email: "hello@hollowbrook.test",
  phone: "+1 (555) 014-2290",
  address: "418 Millrace Lane, Hollowbrook, IL 00000",
};

export const DEMO_ACCOUNTS = [
  {
    businessName: "Tidewater Café",
    deliveryAddress: "12 Harbor Row, Hollowbrook, IL 00000 — back door on the alley, before 7:00",
    contactName: "Marisol Okafor",
    contactPhone: "+1 (555) 013-4410",
    billingEmail: "accounts@tidewater.test",
    notes: "Breakfast trade; wants rolls warm for the 7:00 opening.",
    buyer: { email: "buyer@tidewater.test", name: "Marisol Okafor" },
  },
  {
    businessName: "Juniper Table",
    deliveryAddress: "77 Orchard Street, Hollowbrook, IL 00000 — kitchen entrance",
    contactName: "Declan Reyes",
    contactPhone: "+1 (555) 013-8821",
    billingEmail: "office@junipertable.test",
    notes: "Dinner service; bread basket with every table.",
    buyer: { email: "buyer@junipertable.test", name: "Declan Reyes" },
  },
  {
    businessName: "North Pier Coffee",
    deliveryAddress: "3 Pier Road, Hollowbrook, IL 00000",
    contactName: "Ingrid Halvorsen",
    contactPhone: "+1 (555) 013-2057",
    billingEmail: "ingrid@northpier.test",
    notes: "Small orders, mostly buns at the weekend.",
    buyer: { email: "buyer@northpier.test", name: "Ingrid Halvorsen" },
  },
];

/**
 * The demo bakery's closed days. Dates from 5 U.S.C. § 6103: Christmas Day December 25, New Year's Day January 1,
 * Independence Day July 4, Thanksgiving the fourth Thursday in November (November 25 in 2027).
 */
export const DEMO_CLOSURES: { date: string; note: string }[] = [
  { date: "2026-12-25", note: "Christmas Day" },
  { date: "2027-01-01", note: "New Year's Day" },
  { date: "2027-07-04", note: "Independence Day" },
  { date: "2027-11-25", note: "Thanksgiving Day" },
];

/** The demo's payment instructions on invoices and statements: an invented bank that says it is not real. */
export const DEMO_PAYMENT_INSTRUCTIONS =
  "Bank transfer to Hollowbrook Bakehouse at Hollowbrook Test Savings (demo, not a real bank), routing 000000000, account 0001234567, quoting the invoice number; or a check payable to Hollowbrook Bakehouse.";

export const DEMO_STAFF: { email: string; name: string; role: Role }[] = [
  { email: "owner@hollowbrook.test", name: "Rosalind Hart", role: "owner" },
  { email: "baker@hollowbrook.test", name: "Tomas Lindqvist", role: "baker" },
  { email: "books@hollowbrook.test", name: "Priya Natarajan", role: "bookkeeper" },
];

export const DEMO_SIGN_INS = [
  ...DEMO_STAFF.map((s) => ({ email: s.email, role: s.role as Role })),
  ...DEMO_ACCOUNTS.map((a) => ({ email: a.buyer.email, role: "buyer" as Role, account: a.businessName })),
];

/** Invented products: three doughs (milk bread, honey-oat, brioche), pans in millimetres. */
const NINE_BY_THIRTEEN = { panName: "9×13 in pan", panLengthMm: 330, panWidthMm: 229 };
const HALF_SHEET = { panName: "Half sheet pan", panLengthMm: 457, panWidthMm: 330 };
const PULLMAN = { panName: "13×4 in Pullman pan", panLengthMm: 330, panWidthMm: 102 };
/**
 * Products declare no allergens of their own: every one comes from the formula and the components (the declaration
 * is their union). Bake and cooling default to the formula's steps; the products that differ say so (common practice,
 * no published source: roughly 15–18 min for small buns, 35–45 min for a 900 g lidded loaf, 1–2 h cooling before
 * slicing or bagging a loaf).
 */
const FORMULA_BAKE = { bakeTempC: null as number | null, bakeMinutes: null as number | null, coolMinutes: null as number | null };
export const DEMO_PRODUCTS = [
  { key: "rolls", name: "Milk-bread dinner rolls", description: "Soft, pull-apart rolls made with a cooked milk-and-flour paste. Baked together so the sides stay tender.", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", piecesPerUnit: 15, pieceGrams: 67, ...NINE_BY_THIRTEEN, unitsPerPan: 1, priceCents: 1800, minQuantity: 1, maxQuantity: 40, leadDays: null, allergens: "", mayContain: "sesame", ...FORMULA_BAKE },
  { key: "sliders", name: "Milk-bread slider buns", description: "Small round buns for sliders and breakfast sandwiches, brushed with egg.", saleUnit: "dozen buns", saleUnitPlural: "dozen buns", piecesPerUnit: 12, pieceGrams: 45, ...HALF_SHEET, unitsPerPan: 2, priceCents: 1440, minQuantity: 1, maxQuantity: 30, leadDays: null, allergens: "", mayContain: "sesame", ...FORMULA_BAKE, bakeMinutes: 16 },
  { key: "pullman", name: "Pullman milk loaf", description: "Square, close-crumbed sandwich loaf for toast and tea sandwiches.", saleUnit: "loaf", saleUnitPlural: "loaves", piecesPerUnit: 1, pieceGrams: 900, ...PULLMAN, unitsPerPan: 1, priceCents: 950, minQuantity: 1, maxQuantity: 30, leadDays: null, allergens: "", mayContain: "", ...FORMULA_BAKE, bakeMinutes: 40, coolMinutes: 90 },
  { key: "oat", name: "Honey-oat rolls", description: "Milk-bread rolls with rolled oats and a little honey; oat-topped.", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", piecesPerUnit: 15, pieceGrams: 70, ...NINE_BY_THIRTEEN, unitsPerPan: 1, priceCents: 1950, minQuantity: 1, maxQuantity: 30, leadDays: null, allergens: "", mayContain: "egg,sesame", ...FORMULA_BAKE },
  { key: "brioche", name: "Brioche burger buns", description: "Rich, egg-glazed buns that hold a burger without going soggy.", saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns", piecesPerUnit: 8, pieceGrams: 90, ...HALF_SHEET, unitsPerPan: 2, priceCents: 1600, minQuantity: 1, maxQuantity: 25, leadDays: null, allergens: "", mayContain: "sesame", ...FORMULA_BAKE },
  { key: "sesame", name: "Sesame brioche buns", description: "Our brioche buns topped with toasted sesame.", saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns", piecesPerUnit: 8, pieceGrams: 90, ...HALF_SHEET, unitsPerPan: 2, priceCents: 1700, minQuantity: 1, maxQuantity: 25, leadDays: null, allergens: "", mayContain: "", ...FORMULA_BAKE },
  { key: "swirl", name: "Cinnamon swirl loaf", description: "Milk-bread loaf rolled with cinnamon sugar; needs an extra day's notice.", saleUnit: "loaf", saleUnitPlural: "loaves", piecesPerUnit: 1, pieceGrams: 800, ...PULLMAN, unitsPerPan: 1, priceCents: 1150, minQuantity: 1, maxQuantity: 12, leadDays: 2, allergens: "", mayContain: "tree_nuts", ...FORMULA_BAKE, bakeMinutes: 40, coolMinutes: 90 },
] as const;

/** Standing orders per account: weekday → product key → quantity. */
const DEMO_STANDING: Record<string, { weekdays: Record<number, Record<string, number>>; intervalWeeks: 1 | 2 }> = {
  "Tidewater Café": { intervalWeeks: 1, weekdays: { 2: { rolls: 4, pullman: 2 }, 4: { rolls: 4, sliders: 2 }, 6: { rolls: 6, pullman: 3, swirl: 2 } } },
  "Juniper Table": { intervalWeeks: 1, weekdays: { 3: { rolls: 8, brioche: 4 }, 5: { rolls: 10, brioche: 6, oat: 4 }, 6: { rolls: 12, sesame: 6, oat: 4 } } },
  "North Pier Coffee": { intervalWeeks: 2, weekdays: { 6: { sliders: 3, sesame: 2 } } },
};

/**
 * Invented demo ingredients. Water contents of milk, butter and egg are USDA FoodData Central values
 * (from memory: whole milk ~88 %, unsalted butter ~18 % (salted ~16 %), whole egg ~76 %); flour ~12 %.
 */
const DEMO_INGREDIENTS = [
  { key: "flour", name: "Bread flour", kind: "flour", waterPercent: "12", allergens: "gluten,wheat", packName: "25 kg sack", packGrams: 25000, packCostCents: 2450 },
  { key: "milk", name: "Whole milk", kind: "liquid", waterPercent: "88", allergens: "milk", packName: "1 gal jug", packGrams: 3900, packCostCents: 489 },
  { key: "water", name: "Water", kind: "liquid", waterPercent: "100", allergens: "", packName: "tap", packGrams: 0, packCostCents: 0 },
  { key: "butter", name: "Unsalted butter", kind: "fat", waterPercent: "18", allergens: "milk", packName: "1 lb block", packGrams: 454, packCostCents: 520 },
  { key: "egg", name: "Whole egg", kind: "egg", waterPercent: "76", allergens: "egg", packName: "5 lb liquid-egg carton", packGrams: 2268, packCostCents: 1295 },
  { key: "sugar", name: "Granulated sugar", kind: "sugar", waterPercent: "0", allergens: "", packName: "25 lb bag", packGrams: 11340, packCostCents: 1890 },
  { key: "salt", name: "Fine sea salt", kind: "salt", waterPercent: "0", allergens: "", packName: "3 lb box", packGrams: 1361, packCostCents: 450 },
  { key: "yeast", name: "Instant yeast", kind: "leavening", waterPercent: "5", allergens: "", packName: "1 lb pack", packGrams: 454, packCostCents: 690 },
  { key: "milkpowder", name: "Nonfat dry milk", kind: "other", waterPercent: "3", allergens: "milk", packName: "1 kg bag", packGrams: 1000, packCostCents: 1150 },
  { key: "honey", name: "Honey", kind: "sugar", waterPercent: "17", allergens: "", packName: "5 lb jar", packGrams: 2268, packCostCents: 2100 },
  // EU Regulation 1169/2011 Annex II point 1 lists oats among the cereals containing gluten.
  { key: "oats", name: "Rolled oats", kind: "inclusion", waterPercent: "10", allergens: "gluten", packName: "25 lb bag", packGrams: 11340, packCostCents: 2300 },
  { key: "sesame", name: "Toasted sesame seeds", kind: "inclusion", waterPercent: "2", allergens: "sesame", packName: "5 lb bag", packGrams: 2268, packCostCents: 1650 },
  { key: "cinnamon", name: "Ground cinnamon", kind: "other", waterPercent: "10", allergens: "", packName: "1 lb tub", packGrams: 454, packCostCents: 980 },
] as const;

/**
 * The demo's components, grams per piece (invented; an egg wash of egg and milk is common practice, no published
 * source): egg-washed rolls and buns, the sesame buns' toasted sesame over the wash, the honey-oat topping and the
 * swirl loaf's cinnamon-sugar filling.
 */
const EGG_WASH = (egg: number, milk: number) => [
  { kind: "wash", name: "Egg wash", ingredient: "egg", grams: egg, per: "piece", note: "Whisk egg and milk; brush just before baking." },
  { kind: "wash", name: "Egg wash", ingredient: "milk", grams: milk, per: "piece", note: "" },
] as const;
const DEMO_COMPONENTS: Record<string, readonly { kind: ComponentKind; name: string; ingredient: string; grams: number; per: ComponentPer; note: string }[]> = {
  rolls: EGG_WASH(1, 0.3),
  sliders: EGG_WASH(0.8, 0.2),
  brioche: EGG_WASH(1.2, 0.3),
  sesame: [...EGG_WASH(1.2, 0.3), { kind: "topping", name: "Toasted sesame topping", ingredient: "sesame", grams: 2, per: "piece", note: "Sprinkle over the wet wash." }],
  oat: [
    { kind: "topping", name: "Honey-oat topping", ingredient: "honey", grams: 0.5, per: "piece", note: "Brush the honey on first." },
    { kind: "topping", name: "Honey-oat topping", ingredient: "oats", grams: 1.5, per: "piece", note: "Press the oats on." },
  ],
  swirl: [
    { kind: "filling", name: "Cinnamon-sugar filling", ingredient: "sugar", grams: 40, per: "piece", note: "Mix with the cinnamon; spread over the rolled-out dough." },
    { kind: "filling", name: "Cinnamon-sugar filling", ingredient: "cinnamon", grams: 4, per: "piece", note: "" },
  ],
};

const ROLL_STEPS: StepSpec[] = [
  { kind: "paste", minutes: 40 }, { kind: "mix", minutes: 15 }, { kind: "bulk", minutes: 60 }, { kind: "divide", minutes: 25 },
  { kind: "bench", minutes: 10 }, { kind: "shape", minutes: 25 }, { kind: "proof", minutes: 50 }, { kind: "wash", minutes: 5 },
  { kind: "bake", minutes: 27, temperatureC: 177 }, { kind: "cool", minutes: 60 },
];
const DEMO_FORMULAS: { name: string; products: string[]; body: (id: Record<string, number>) => object }[] = [
  {
    name: "Milk bread", products: ["rolls", "sliders", "pullman", "swirl"],
    body: (id) => ({ lossPercent: 2, ddtC: 26, frictionC: 12, targetInternalC: 89,
      paste: { flourIngredientId: id.flour, liquidIngredientId: id.milk, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
      lines: [{ ingredientId: id.flour, percent: 100 }, { ingredientId: id.milk, percent: 58 }, { ingredientId: id.egg, percent: 10 }, { ingredientId: id.butter, percent: 10 },
        { ingredientId: id.sugar, percent: 10 }, { ingredientId: id.milkpowder, percent: 4 }, { ingredientId: id.salt, percent: 1.8 }, { ingredientId: id.yeast, percent: 1.3 }],
      steps: ROLL_STEPS }),
  },
  {
    name: "Honey-oat milk bread", products: ["oat"],
    body: (id) => ({ lossPercent: 2, ddtC: 26, frictionC: 12, targetInternalC: 89,
      paste: { flourIngredientId: id.flour, liquidIngredientId: id.milk, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
      lines: [{ ingredientId: id.flour, percent: 100 }, { ingredientId: id.milk, percent: 55 }, { ingredientId: id.water, percent: 8 }, { ingredientId: id.oats, percent: 15 },
        { ingredientId: id.honey, percent: 8 }, { ingredientId: id.butter, percent: 8 }, { ingredientId: id.salt, percent: 1.8 }, { ingredientId: id.yeast, percent: 1.4 }],
      steps: ROLL_STEPS }),
  },
  {
    name: "Brioche", products: ["brioche", "sesame"],
    body: (id) => ({ lossPercent: 3, ddtC: 24, frictionC: 14, targetInternalC: 88, paste: null,
      lines: [{ ingredientId: id.flour, percent: 100 }, { ingredientId: id.egg, percent: 45 }, { ingredientId: id.milk, percent: 12 }, { ingredientId: id.butter, percent: 40 },
        { ingredientId: id.sugar, percent: 12 }, { ingredientId: id.salt, percent: 2 }, { ingredientId: id.yeast, percent: 1.5 }],
      steps: [{ kind: "mix", minutes: 20 }, { kind: "bulk", minutes: 75 }, { kind: "divide", minutes: 20 }, { kind: "bench", minutes: 10 }, { kind: "shape", minutes: 25 },
        { kind: "proof", minutes: 70 }, { kind: "wash", minutes: 5 }, { kind: "bake", minutes: 16, temperatureC: 190 }, { kind: "cool", minutes: 60 }] }),
  },
];

/**
 * The demo bakehouse (invented): a 20 kg spiral mixer and a 60-qt planetary; a three-deck oven (about two half
 * sheets a deck: 9,100 cm² usable) and a five-shelf convection oven (one half sheet per shelf); three people on
 * a shift that starts at 23:30 the evening before; 45 min to pack and load. Person-minutes from memory (common
 * practice, no source): about 9 s to divide and round a roll, 12 s to shape it, 30 s to fill and set out a pan.
 */
export const DEMO_BAKEHOUSE = {
  settings: { crewPeople: 3, divideMinutesPerPiece: "0.15", shapeMinutesPerPiece: "0.2", panMinutesPerPan: "0.5", packingMinutes: 45, shiftStart: "23:30", retard: "[]" },
  mixers: [{ name: "Spiral mixer", capacityKg: "20", sortOrder: 0 }, { name: "60-qt planetary", capacityKg: "12", sortOrder: 1 }],
  ovens: [
    { name: "Deck oven", capacityKind: "area" as const, areaCm2: 9100, slotNames: "[]", slotLengthMm: null, slotWidthMm: null, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 3, sortOrder: 0 },
    { name: "Convection oven", capacityKind: "slots" as const, areaCm2: null, slotNames: JSON.stringify(["Shelf 1", "Shelf 2", "Shelf 3", "Shelf 4", "Shelf 5"]), slotLengthMm: 460, slotWidthMm: 335, tempChangeMinutes: 10, loadMinutes: 2, unloadMinutes: 2, sortOrder: 1 },
  ],
};

/** Idempotent: running it again changes nothing that is already there. */
export async function seedDemo(ds: DataSource): Promise<{ created: number }> {
  let created = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await ds.transaction(async (m) => {
    const bakeries = m.getRepository(Bakery);
    const bakery = await bakeries.findOne({ where: {} });
    if (!bakery) {
      await bakeries.insert(DEMO_BAKERY);
      created++;
    } else if (bakery.address === DEMO_BAKERY.address.replace("IL 00000", "IL 60000") || bakery.paymentInstructions.includes("Prairie Mutual Bank")) {
      // Demo data seeded before the demo used ZIP 00000 and an invented bank (server/seed/billing.ts).
      await bakeries.update({ id: bakery.id }, {
        address: bakery.address.replace("IL 60000", "IL 00000"),
        paymentInstructions: bakery.paymentInstructions.includes("Prairie Mutual Bank") ? DEMO_PAYMENT_INSTRUCTIONS : bakery.paymentInstructions,
      });
      created++;
    }
    const users = m.getRepository(User);
    for (const s of DEMO_STAFF) {
      if (!(await users.existsBy({ email: s.email }))) {
        await users.insert({ ...s, passwordHash, accountId: null, disabled: false });
        created++;
      }
    }
    const accounts = m.getRepository(CustomerAccount);
    for (const { buyer, ...a } of DEMO_ACCOUNTS) {
      let account = await accounts.findOneBy({ businessName: a.businessName });
      if (!account) {
        account = await accounts.save(accounts.create({ ...a, status: "active" }));
        created++;
      } else if (/, IL 6000[1-3]\b/.test(account.deliveryAddress)) {
        // Demo data seeded before the demo addresses used ZIP 00000.
        await accounts.update({ id: account.id }, { deliveryAddress: account.deliveryAddress.replace(/, IL 6000[1-3]\b/, ", IL 00000") });
        created++;
      }
      if (!(await users.existsBy({ email: buyer.email }))) {
        await users.insert({ ...buyer, role: "buyer", accountId: account.id, passwordHash, disabled: false });
        created++;
      }
    }

    const products = m.getRepository(Product);
    const ids: Record<string, number> = {};
    for (const [i, { key, ...p }] of DEMO_PRODUCTS.entries()) {
      let row = await products.findOneBy({ name: p.name });
      if (!row) {
        row = await products.save(products.create({ ...p, leadDays: p.leadDays, photoFile: null, active: true, formulaId: null, sortOrder: i }));
        created++;
      } else if (!row.saleUnitPlural) {
        // A demo database from before plurals were stored: the product and the lines ordered of it get theirs.
        await products.update({ id: row.id }, { saleUnitPlural: p.saleUnitPlural });
        await m.getRepository(OrderLine).update({ productId: row.id, saleUnit: p.saleUnit, saleUnitPlural: "" }, { saleUnitPlural: p.saleUnitPlural });
      }
      ids[key] = row.id;
    }

    const ingredients = m.getRepository(Ingredient);
    const ing: Record<string, number> = {};
    for (const { key, ...i } of DEMO_INGREDIENTS) {
      let row = await ingredients.findOneBy({ name: i.name });
      if (!row) {
        row = await ingredients.save(ingredients.create(i));
        created++;
      } else if (key === "oats" && row.allergens === "") {
        // Demo data seeded before oats carried their gluten flag (EU 1169/2011 Annex II point 1).
        await ingredients.update({ id: row.id }, { allergens: i.allergens });
        created++;
      }
      ing[key] = row.id;
    }
    for (const f of DEMO_FORMULAS) {
      let formula = await m.getRepository(Formula).findOneBy({ name: f.name });
      if (!formula) {
        formula = await m.getRepository(Formula).save(m.getRepository(Formula).create({ name: f.name, currentVersion: 1 }));
        await m.getRepository(FormulaVersion).insert({ formulaId: formula.id, version: 1, body: JSON.stringify({ name: f.name, ...f.body(ing) }), editedById: null, note: "Demo formula" });
        created++;
      }
      for (const key of f.products) {
        const p = await products.findOneByOrFail({ id: ids[key] });
        if (p.formulaId === null) await products.update({ id: p.id }, { formulaId: formula.id });
      }
    }
    const components = m.getRepository(ProductComponent);
    for (const [key, rows] of Object.entries(DEMO_COMPONENTS)) {
      if (await components.existsBy({ productId: ids[key] })) continue;
      await components.insert(rows.map((c, i) => ({ productId: ids[key], sortOrder: i, kind: c.kind, name: c.name, ingredientId: ing[c.ingredient], grams: c.grams.toFixed(1), per: c.per, note: c.note })));
      created++;
    }

    const lists = m.getRepository(PriceList);
    let partners = await lists.findOneBy({ name: "Café partners" });
    if (!partners) {
      partners = await lists.save(lists.create({ name: "Café partners", kind: "percent", percentOff: "10" }));
      created++;
    }
    let restaurant = await lists.findOneBy({ name: "Restaurant volume" });
    if (!restaurant) {
      restaurant = await lists.save(lists.create({ name: "Restaurant volume", kind: "fixed", percentOff: "0" }));
      await m.getRepository(PriceListItem).insert([
        { priceListId: restaurant.id, productId: ids.rolls, priceCents: 1650 },
        { priceListId: restaurant.id, productId: ids.brioche, priceCents: 1480 },
        { priceListId: restaurant.id, productId: ids.oat, priceCents: 1800 },
      ]);
      created++;
    }
    const accountSettings: Record<string, { routeWeekdays: string | null; minimumOrderCents: number; priceListId: number | null }> = {
      "Tidewater Café": { routeWeekdays: "2,4,6", minimumOrderCents: 5000, priceListId: partners.id },
      "Juniper Table": { routeWeekdays: "3,5,6", minimumOrderCents: 10000, priceListId: restaurant.id },
      "North Pier Coffee": { routeWeekdays: "6", minimumOrderCents: 4000, priceListId: null },
    };
    for (const [name, settings] of Object.entries(accountSettings)) {
      const a = await accounts.findOneByOrFail({ businessName: name });
      if (a.routeWeekdays === null && a.minimumOrderCents === 0) await accounts.update({ id: a.id }, settings);
    }

    if (!(await m.getRepository(ProductionSettings).existsBy({ id: 1 }))) {
      await m.getRepository(ProductionSettings).insert({ id: 1, ...DEMO_BAKEHOUSE.settings });
      if (!(await m.getRepository(BakehouseMixer).count())) await m.getRepository(BakehouseMixer).insert(DEMO_BAKEHOUSE.mixers);
      if (!(await m.getRepository(BakehouseOven).count())) await m.getRepository(BakehouseOven).insert(DEMO_BAKEHOUSE.ovens);
      created++;
    }

    const closures = m.getRepository(BakeryClosure);
    // Demo databases seeded before the closures were US holidays carry a "Boxing Day" closure: take that one out.
    await closures.delete({ date: "2026-12-26", note: "Boxing Day" });
    for (const c of DEMO_CLOSURES) {
      if (!(await closures.existsBy({ date: c.date }))) {
        await closures.insert(c);
        created++;
      }
    }

    const standing = m.getRepository(StandingOrder);
    for (const [name, plan] of Object.entries(DEMO_STANDING)) {
      const a = await accounts.findOneByOrFail({ businessName: name });
      if (await standing.existsBy({ accountId: a.id })) continue;
      const weekdays = Object.keys(plan.weekdays).map(Number) as Weekday[];
      const startDate = "2026-11-02";
      const so = await standing.save(standing.create({ accountId: a.id, startDate, endDate: null, intervalWeeks: plan.intervalWeeks, rrule: weeklyRule({ startDate, endDate: null, intervalWeeks: plan.intervalWeeks, weekdays }), skipDates: JSON.stringify(name === "Tidewater Café" ? ["2026-12-31"] : []), active: true }));
      const lines = Object.entries(plan.weekdays).flatMap(([wd, items]) => Object.entries(items).map(([key, quantity]) => ({ standingOrderId: so.id, productId: ids[key], weekday: Number(wd), quantity })));
      await m.getRepository(StandingOrderLine).insert(lines);
      created++;
    }
  });
  return { created };
}

/** The database is "empty" when it has no bakery yet. */
export async function isEmpty(ds: DataSource): Promise<boolean> {
  return (await ds.getRepository(Bakery).count()) === 0;
}
