/**
 * The bakery's locale (bakery.locale, BCP 47): set by the owner with the calendar settings, used by the e-mails,
 * the API's own messages and the bakery DTO the screens format with. Expected strings: Unicode CLDR via Node's ICU
 * (en-US "EEEE, MMMM d" / "EEE, MMM d, h:mm a z"; en-GB "EEEE d MMMM" / "EEE d MMM, HH:mm").
 */
import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, waitForMail, auth, type TestApp } from "./helpers/app";

/** Clock: Wed 10 Jun 2026 10:00 CDT. Thu 11 Jun's cut-off is Wed 10 Jun 14:00 CDT. */
const NOW = "2026-06-10T15:00:00Z";

let t: TestApp;
let owner: string;
let buyer: string;
let buyerEmail: string;
let rolls: { id: number };
const settings = { timeZone: "America/Chicago", deliveryWeekdays: [2, 3, 4, 5, 6], cutoffTime: "14:00", leadDays: 1, horizonDays: 28, closures: [] };

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Locale Bakery" });
  const account = await makeAccount(t.ds, { businessName: "Harbor Café" });
  const u = await makeUser(t.ds, "buyer", { accountId: account.id });
  buyerEmail = u.email;
  buyer = await tokenFor(t, u);
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  rolls = await makeProduct(t.ds, { name: "Dinner rolls", priceCents: 1800, maxQuantity: 40 });
});
afterAll(() => t.close());

const put = (body: object, token = owner) => t.http().put("/api/settings/calendar").set(auth(token)).send(body);

describe("the bakery's locale", () => {
  it("is en-US until the owner changes it, in the bakery and the calendar settings", async () => {
    expect((await t.http().get("/api/bakery").set(auth(buyer))).body.bakery.locale).toBe("en-US");
    expect((await t.http().get("/api/settings/calendar").set(auth(owner))).body.settings.locale).toBe("en-US");
  });

  it("an e-mail in en-US: 'Thursday, June 11' and the cut-off 'Wed, Jun 10, 2:00 PM CDT'", async () => {
    const res = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-11", lines: [{ productId: rolls.id, quantity: 3 }] });
    expect(res.status).toBe(201);
    const mail = await waitForMail(t, buyerEmail, { subject: /Thursday, June 11/ });
    expect(mail.text).toContain("— $54.00");
    expect(mail.text).toContain("You can change it until the cut-off, Wed, Jun 10, 2:00 PM CDT.");
  });

  it("refuses a tag it does not offer with a 400 naming the choices, and keeps the stored one", async () => {
    for (const bad of ["fr-FR", "en", "klingon", 42]) {
      const res = await put({ ...settings, locale: bad });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("validation_failed");
      expect(res.body.error.fields.locale).toMatch(/en-US, en-CA, en-GB, en-AU/);
    }
    expect((await t.http().get("/api/bakery").set(auth(buyer))).body.bakery.locale).toBe("en-US");
  });

  it("only the owner may set it", async () => {
    expect((await put({ ...settings, locale: "en-GB" }, buyer)).status).toBe(403);
  });

  it("the owner sets en-GB; the next e-mail and the API's messages use it", async () => {
    const res = await put({ ...settings, locale: "en-GB" });
    expect(res.status).toBe(200);
    expect(res.body.settings.locale).toBe("en-GB");
    expect((await t.http().get("/api/bakery").set(auth(buyer))).body.bakery.locale).toBe("en-GB");

    const placed = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-12", lines: [{ productId: rolls.id, quantity: 2 }] });
    expect(placed.status).toBe(201);
    const mail = await waitForMail(t, buyerEmail, { subject: /Friday 12 June/ });
    expect(mail.text).toContain("delivery Friday 12 June:");
    expect(mail.text).toContain("You can change it until the cut-off, Thu 11 Jun, 14:00 GMT-5."); // CLDR en_GB has no short name for Chicago's zone
    expect(mail.text).toContain("— US$36.00"); // CLDR en_GB writes USD as "US$"

    // Past Thursday's cut-off (Wed 10 Jun 14:00 CDT): the refusal names the day and the cut-off in en-GB.
    t.clock.set("2026-06-10T19:30:00Z");
    const late = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-11", lines: [{ productId: rolls.id, quantity: 1 }] });
    t.clock.set(NOW);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toBe("Orders for Thu 11 Jun closed at the cut-off, Wed 10 Jun, 14:00 GMT-5. Call the bakery if something has gone wrong.");
  });

  it("a PUT without a locale keeps the stored one", async () => {
    const res = await put(settings);
    expect(res.status).toBe(200);
    expect(res.body.settings.locale).toBe("en-GB");
  });
});
