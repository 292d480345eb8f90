import ICAL from "ical.js";
import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";

/**
 * Issue 8 item 12: the calendar feed, parsed with an independent iCalendar parser (ical.js).
 * RFC 5545 §3.8.7.2: DTSTAMP "MUST be specified in the UTC time format" (…Z). §3.3.11: TEXT carries line breaks
 * only escaped as "\n", and no other CONTROL characters, so a name with CR/LF must not start a new property.
 */
const NOW = "2026-12-02T13:43:25Z"; // the issue's own instant: it saw DTSTAMP:20261202T134325 without the Z
let t: TestApp;
let owner: string;

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Feed Bakery", timeZone: "America/Chicago" });
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
}, 60_000);
afterAll(() => t.close());

/** Lines of the feed with folding undone (RFC 5545 §3.1: CRLF followed by one space or tab continues a line). */
const unfold = (ics: string) => ics.replace(/\r\n[ \t]/g, "").split("\r\n").filter(Boolean);

async function feedOf(accountId: number): Promise<string> {
  const created = await t.http().post(`/api/calendar-feed?accountId=${accountId}`).set(auth(owner));
  expect(created.status).toBe(201);
  const res = await t.http().get(new URL(created.body.url).pathname);
  expect(res.status).toBe(200);
  return res.text;
}

describe("calendar feed", () => {
  it("writes every DTSTAMP in UTC (…Z) and a name or address with CR/LF cannot add a property or an event", async () => {
    // A row written before names were checked (or by other means): the feed must still be safe.
    const account = await makeAccount(t.ds, {
      businessName: "Evil Café\r\nX-INJECTED:1\r\nBEGIN:VEVENT\r\nUID:forged",
      deliveryAddress: "1 Dock Rd\r\nATTENDEE:mailto:evil@evil.test\nX-ALSO:2\u0007",
    });
    const product = await makeProduct(t.ds, { name: "Rolls\r\nX-PRODUCT:3" });
    const placed = await t.http().post("/api/orders").set(auth(owner)).send({ accountId: account.id, deliveryDate: "2026-12-08", lines: [{ productId: product.id, quantity: 2 }] });
    expect(placed.status).toBe(201);
    await t.http().post("/api/orders").set(auth(owner)).send({ accountId: account.id, deliveryDate: "2026-12-09", lines: [{ productId: product.id, quantity: 1 }] }).expect(201);

    const ics = await feedOf(account.id);
    const cal = new ICAL.Component(ICAL.parse(ics));
    const events = cal.getAllSubcomponents("vevent");
    expect(events).toHaveLength(2);
    expect(cal.getAllProperties().map((p) => p.name).sort()).toEqual(["name", "prodid", "version", "x-wr-calname"]);
    for (const ev of events) {
      expect(ev.getAllProperties().map((p) => p.name).filter((n) => n.startsWith("x-") && !n.startsWith("x-microsoft"))).toEqual([]);
      expect(ev.getFirstProperty("attendee")).toBeNull();
      const stamp = ev.getFirstPropertyValue("dtstamp") as ICAL.Time;
      expect(stamp.zone).toBe(ICAL.Timezone.utcTimezone);
      expect(ev.getFirstPropertyValue("uid")).toMatch(/^order-\d+@panwise$/);
    }
    // The text survives as text: the line breaks are escaped, the BEL (U+0007) is dropped.
    // NAME is TEXT (RFC 7986 §5.1); ical.js does not know NAME or X-WR-CALNAME, keeps them as written, and its
    // TEXT decoder turns the escapes back into the original line breaks.
    const text = (raw: unknown) => (ICAL.design.icalendar.value.text as unknown as { fromICAL(v: string): string }).fromICAL(String(raw));
    for (const prop of ["name", "x-wr-calname"]) {
      expect(text(cal.getFirstPropertyValue(prop))).toBe("Feed Bakery deliveries — Evil Café\nX-INJECTED:1\nBEGIN:VEVENT\nUID:forged");
    }
    expect(events[0].getFirstPropertyValue("location")).toBe("1 Dock Rd\nATTENDEE:mailto:evil@evil.test\nX-ALSO:2");
    expect(String(events[0].getFirstPropertyValue("description"))).toContain("Rolls\nX-PRODUCT:3 — 2 trays of 15 rolls");
    expect(String(events[1].getFirstPropertyValue("description"))).toContain("Rolls\nX-PRODUCT:3 — 1 tray of 15 rolls");
    // The status as a person reads it (shared/schemas/orders.ts ORDER_STATUS_LABELS), never the stored code "open";
    // the summary counts products, never trays plus loaves.
    expect(String(events[0].getFirstPropertyValue("description"))).toMatch(/\nStatus: Open$/);
    expect(String(events[0].getFirstPropertyValue("summary"))).toBe("Feed Bakery delivery (1 product)");

    // The raw lines agree: each DTSTAMP is YYYYMMDDTHHMMSSZ (RFC 5545 §3.3.5 form 2, UTC).
    const stamps = unfold(ics).filter((l) => l.startsWith("DTSTAMP"));
    expect(stamps).toHaveLength(2);
    for (const s of stamps) expect(s).toMatch(/^DTSTAMP:\d{8}T\d{6}Z$/);
    expect(unfold(ics).filter((l) => /^(X-INJECTED|ATTENDEE|X-ALSO|X-PRODUCT|UID:forged)/.test(l))).toEqual([]);
    // Nothing but CRLF line ends and printable text (RFC 5545 §3.1, §3.3.11).
    expect(ics.replace(/\r\n/g, "")).not.toMatch(/[\u0000-\u0008\u000A-\u001F\u007F]/);
  });
});

describe("names are refused with control characters", () => {
  it("refuses CR, LF or other control characters in a business or contact name, and keeps line breaks in an address", async () => {
    const base = { businessName: "Harbor Café", deliveryAddress: "1 Dock Rd", billingEmail: "a@harbor.test" };
    for (const bad of ["Evil\r\nX-INJECTED:1", "Evil\nCafé", "Evil\u0000", "Evil\u2028Café"]) {
      const res = await t.http().post("/api/accounts").set(auth(owner)).send({ ...base, businessName: bad });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.businessName).toBe("Business name must be one line, without line breaks or control characters.");
    }
    const contact = await t.http().post("/api/accounts").set(auth(owner)).send({ ...base, contactName: "Ann\r\nBcc: x@evil.test" });
    expect(contact.status).toBe(400);
    expect(contact.body.error.fields.contactName).toMatch(/one line/);
    const bell = await t.http().post("/api/accounts").set(auth(owner)).send({ ...base, deliveryAddress: "1 Dock Rd\u0007" });
    expect(bell.status).toBe(400);
    expect(bell.body.error.fields.deliveryAddress).toBe("Delivery address cannot contain control characters.");

    const ok = await t.http().post("/api/accounts").set(auth(owner)).send({ ...base, deliveryAddress: "1 Dock Rd\r\nBack door" });
    expect(ok.status).toBe(201);
    expect(ok.body.account.deliveryAddress).toBe("1 Dock Rd\nBack door");
    const patched = await t.http().patch(`/api/accounts/${ok.body.account.id}`).set(auth(owner)).send({ businessName: "Harbor\r\nX:1" });
    expect(patched.status).toBe(400);
  });
});
