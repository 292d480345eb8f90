/**
 * Issue 10 "Panwise's own words", first check: every string the app and the server can show a person, in one list,
 * checked against the rules below. The strings are COLLECTED, not listed by hand:
 *  - screens (app/, components/): read with the TypeScript compiler API — JSX text, the visible attributes named in
 *    VISIBLE_ATTRS, JSX expression children, object properties named in VISIBLE_PROPS, values of label maps
 *    (names ending in LABEL/LABELS/…), strings handed to the notice setters (setSaved, setDone, …);
 *  - shared/: the label maps at run time, and the messages and texts in the source;
 *  - server/: HttpError messages (and badRequest/conflict/forbidden/unauthorized), zod messages (here and in shared/schemas);
 *  - e-mails: every template in server/mail/templates.ts called with sample data (subject, text, HTML stripped of tags);
 *  - PDFs: the literal strings of server/billing/invoice.pdf.ts and server/production/plan.pdf.ts (rendering them needs
 *    DTOs from the database; the words are all literals there);
 *  - CSV headers: the header constants of server/billing/reports.service.ts and the orders board's header;
 *  - the local payment page (fakes/stripe): payPage rendered with every field error and every decline, and the
 *    message pages of fakes/stripe/hosted.ts.
 * Not in scope: developer-only text (logs, thrown Errors that are not HttpErrors, comments), the fake's API JSON.
 */
import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { CSV_HEADER_STYLE, INVOICE_CSV_COLUMNS, PAYMENT_CSV_COLUMNS, PAYOUT_CSV_COLUMNS } from "../../server/billing/reports.service";
import { boardCsv } from "../../server/orders/board.service";
import { MAIL_KINDS, MAIL_KIND_LABELS } from "../../shared/mail";
import { ORDER_STATUSES } from "../../shared/schemas/orders";
import { ACCOUNT_STATUSES } from "../../shared/schemas/accounts";
import { ROLES } from "../../shared/roles";
import { PAYMENT_TERMS, INVOICE_STATUS_LABELS, PAYMENT_METHOD_LABELS, PAYOUT_STATUS_LABELS, INVOICE_KIND_LABELS } from "../../shared/billing";
import { STEP_KINDS, INGREDIENT_KINDS } from "../../shared/production";
import { COMPONENT_KINDS } from "../../shared/components";
import { ROOT, Word, collectLiterals, collectMails, collectPayPage, collectScreens, collectSharedLabels, collectSource, walkFiles } from "./words-collect";

const SNAKE = /\b[a-z][a-z0-9]*(?:_[a-z0-9]+)+\b/;
/** A visible template that prints a stored code field as it is (`${o.status}`) instead of its label. */
const RAW_FIELD = /^[\w.?!]+\.(status|kind|method|role|type|source|disposition|paymentTerms|bucket)$/;
/** Not codes: a form's field errors (`fields.role` is the message for the role field) and the HTTP request line of a 404. */
const NOT_A_CODE_FIELD = /^(fields|errors|fieldErrors|req)\b/;
/** Allowed snake_case in visible text, each with its reason. */
const SNAKE_ALLOW: Record<string, string> = {};

/**
 * Rule 3, US English (the bakery's locale: en-US for the demo bakery; spellings per Merriam-Webster, from memory).
 * The en-GB forms, as whole words, any case.
 */
const EN_GB = [
  "cheque", "cheques", "colour", "colours", "coloured", "favour", "favourite", "behaviour", "centre", "centres", "metre", "metres", "litre", "litres",
  "organise", "sulphite", "sulphites", "sulphur", "molluscs", "organised", "organising", "organisation", "catalogue", "licence", "programme", "cancelled", "cancelling", "grey", "judgement", "enrolment",
  "travelled", "labelled", "labelling", "modelled", "fulfil", "aluminium", "whilst", "amongst", "neutralise", "neutralised", "recognise", "realise",
  "apologise", "customise", "finalise", "prioritise", "summarise", "minimise", "maximise", "emphasise", "gelatinise", "caramelise", "caramelised", "authorise",
  "authorised", "optimise", "analyse", "defence", "offence", "practise", "mould", "moulded", "flavour", "flavours", "savoury", "honour", "neighbour",
  "storey", "tonne", "tonnes", "artefact", "manoeuvre", "paediatric", "ageing", "enquiry", "enquiries", "fibre", "theatre", "tyre", "kerb", "plough",
];
const EN_GB_RE = new RegExp(`\\b(${EN_GB.join("|")})\\b`, "i");

/**
 * Rule 4, copied payment-form wording (issue 10 item 1): sentences of a well-known hosted card form and its API,
 * which the person-facing page must not reuse (from memory: the commercial form's card-field errors and decline texts).
 */
const COPIED = [
  "Your card number is incomplete.", "Your card number is invalid.", "Your card's expiration year is in the past.", "Your card's expiration date is incomplete.",
  "Your card's expiration date is in the past.", "Your card's security code is incomplete.", "Your card's security code is incorrect.",
  "Your card's security code is invalid.", "Your postal code is incomplete.", "1234 1234 1234 1234", "MM / YY", "There is no checkout session with this address.",
  "Your card was declined.", "Your card has insufficient funds.", "Your card has expired.", "Your card does not support this type of purchase.",
  "An error occurred while processing your card. Try again in a little bit.", "checkout session",
];

/** Rule 2, the CSV spec in DEVELOPERS.md ("CSV exports"): CSV_HEADER_STYLE, the same pattern tests/server/payments.test.ts uses. */

const ENUM_CODES = new Set<string>([
  ...ORDER_STATUSES, ...ACCOUNT_STATUSES, ...ROLES, ...PAYMENT_TERMS, ...Object.keys(INVOICE_STATUS_LABELS), ...Object.keys(INVOICE_KIND_LABELS),
  ...Object.keys(PAYMENT_METHOD_LABELS), ...Object.keys(PAYOUT_STATUS_LABELS), ...MAIL_KINDS, ...STEP_KINDS, ...INGREDIENT_KINDS, ...COMPONENT_KINDS,
]);

interface Violation { where: string; text: string; rule: string }

function check(words: Word[]): Violation[] {
  const v: Violation[] = [];
  const where = (w: Word) => (w.line ? `${w.file}:${w.line}` : w.file);
  for (const w of words) {
    const snake = w.text.replace(/\{…\}/g, " ").match(SNAKE);
    if (snake && !SNAKE_ALLOW[snake[0]]) v.push({ where: where(w), text: w.text, rule: `raw code "${snake[0]}"${ENUM_CODES.has(snake[0]) ? " (a stored enum value)" : " (snake_case)"} in a visible string — issue 10 "No raw codes reach a person"` });
    else if (!w.fragment && ENUM_CODES.has(w.text) && /^[a-z0-9_]+$/.test(w.text)) v.push({ where: where(w), text: w.text, rule: `a stored code shown as the whole string — issue 10 "No raw codes reach a person"` });
    for (const hole of w.interpolated ?? []) if (RAW_FIELD.test(hole) && !NOT_A_CODE_FIELD.test(hole)) v.push({ where: where(w), text: `${w.text}  [${hole}]`, rule: `prints the stored code ${hole} as is, not its label — issue 10 "No raw codes reach a person"` });
    const gb = w.text.match(EN_GB_RE);
    if (gb) v.push({ where: where(w), text: w.text, rule: `en-GB spelling "${gb[0]}" — the bakery's locale is en-US (Merriam-Webster)` });
    for (const c of COPIED) if (w.text.toLowerCase().includes(c.toLowerCase())) v.push({ where: where(w), text: w.text, rule: `copied payment-form wording "${c}" — issue 10 item 1` });
  }
  return v;
}

// ---- the test -------------------------------------------------------------------------------------------

const files = (dir: string, ext = /\.tsx?$/) => walkFiles(dir, ext);
let words: Word[] = [];
const counts: Record<string, number> = {};

beforeAll(async () => {
  const screens = collectScreens([...files("app"), ...files("components")]);
  const shared = [...collectSource([...files("shared")], "shared source", { errors: false, zod: true, props: true }), ...(await collectSharedLabels())];
  const server = collectSource(files("server").filter((f) => !f.includes(`${path.sep}migrations${path.sep}`) && !f.includes(`${path.sep}seed${path.sep}`)), "server errors and schemas", { errors: true, zod: true, props: false });
  const pdfs = [...collectLiterals("server/billing/invoice.pdf.ts", "PDFs"), ...collectLiterals("server/production/plan.pdf.ts", "PDFs")];
  const board = boardCsv({ date: "2026-06-09", products: [{ id: 1, name: "Dinner rolls", saleUnit: "tray of 15 rolls", total: 1 }], rows: [], totalCents: 0 } as never, "USD").split(/\r?\n/)[0]!.split(",");
  const csv: Word[] = [
    ...[["invoices", INVOICE_CSV_COLUMNS], ["payments", PAYMENT_CSV_COLUMNS], ["payouts", PAYOUT_CSV_COLUMNS]].flatMap(([k, cols]) => (cols as string[]).map((text) => ({ source: "CSV headers", file: `server/billing/reports.service.ts ${k}`, line: 0, text }))),
    ...board.filter((h) => !h.includes("(tray")).map((text) => ({ source: "CSV headers", file: "server/orders/board.service.ts boardCsv", line: 0, text })),
  ];
  const mails = await collectMails();
  const pay = await collectPayPage();
  words = [...screens, ...shared, ...server, ...pdfs, ...csv, ...mails, ...pay];
  for (const w of words) counts[w.source] = (counts[w.source] ?? 0) + 1;
  // A reader of the test output sees that the list is not empty.
  console.log(`words.test collected ${words.length} visible strings: ${JSON.stringify(counts)}`);
}, 20_000);

describe("every string Panwise shows a person (issue 10 \"Checks\")", () => {
  it("collects from every source, enough that it cannot pass by collecting nothing", () => {
    expect(counts.screens).toBeGreaterThan(1000);
    expect(counts["shared labels"]).toBeGreaterThan(50);
    expect(counts["shared source"]).toBeGreaterThan(50);
    expect(counts["server errors and schemas"]).toBeGreaterThan(100);
    expect(counts.PDFs).toBeGreaterThan(20);
    expect(counts["CSV headers"]).toBe(INVOICE_CSV_COLUMNS.length + PAYMENT_CSV_COLUMNS.length + PAYOUT_CSV_COLUMNS.length + 5); // the board: Delivery Date, Account, Status, PO Number, Order Total (USD)
    expect(counts["e-mails"]).toBeGreaterThan(50);
    expect(counts["payment page"]).toBeGreaterThan(50);
    // Spot checks that the collectors reach what they claim to (each string is on today's screens or pages).
    const texts = new Set(words.map((w) => w.text));
    for (const t of ["Card number", "Send again", "Invoice Number", "Reset your password", "Subtotal"]) expect(texts).toContain(t);
  });

  it("the rules catch what they are for (each rule refuses a sample)", () => {
    const sample = (text: string, interpolated?: string[]) => check([{ source: "sample", file: "sample", line: 1, text, interpolated }]).map((x) => x.rule.split(" — ")[0]);
    expect(sample("Status: partially_refunded")).toEqual([expect.stringContaining("stored enum value")]);
    expect(sample("Step ab_cd")).toEqual([expect.stringContaining("snake_case")]);
    expect(sample("locked")).toEqual([expect.stringContaining("whole string")]);
    expect(sample("{…}, {…}", ["o.status", "money(o.totalCents)"])).toEqual([expect.stringContaining("o.status")]);
    expect(sample("Pay by Cheque")).toEqual([expect.stringContaining("en-GB spelling")]);
    expect(sample("Order canceled")).toEqual([]);
    expect(sample("Your card was declined.")).toEqual([expect.stringContaining("copied")]);
    for (const bad of ["stripe_payment_intent", "amount_due", "Delivery date", "PO number"]) expect(bad).not.toMatch(CSV_HEADER_STYLE);
    expect("Order Total (USD)").toMatch(CSV_HEADER_STYLE);
  });

  it("every kind of e-mail the server queues has a label (shared/mail.ts), and none is a code", () => {
    // The literal kinds handed to enqueueMail in server/ (the order kinds are built as `order_${kind}`).
    const kinds = new Set<string>();
    for (const f of files("server")) {
      for (const m of fs.readFileSync(path.join(ROOT, f), "utf8").matchAll(/enqueueMail\(\s*\w+,\s*\w+(?:\.\w+)?,\s*(["`])([^"`]+)\1/g)) {
        const k = m[2]!;
        if (k.includes("${")) for (const s of ["placed", "changed", "cancelled"]) kinds.add(k.replace(/\$\{[^}]+\}/, s));
        else kinds.add(k);
      }
    }
    expect(kinds.size).toBeGreaterThanOrEqual(5);
    for (const k of kinds) expect(MAIL_KINDS).toContain(k);
    for (const k of MAIL_KINDS) expect(MAIL_KIND_LABELS[k]).toMatch(/^[A-Z][a-z -]+$/);
  });

  it("breaks none of the rules: no raw codes, CSV headers in one style, en-US spelling, no copied payment-form wording", () => {
    const violations = check(words);
    for (const w of words.filter((x) => x.source === "CSV headers")) {
      if (!CSV_HEADER_STYLE.test(w.text)) violations.push({ where: w.file, text: w.text, rule: "CSV header not plain words in Title Case — the CSV spec in DEVELOPERS.md" });
    }
    const report = [...new Set(violations.map((x) => `${x.where}\t${JSON.stringify(x.text)}\t${x.rule}`))].sort();
    if (process.env.WORDS_REPORT) fs.writeFileSync(process.env.WORDS_REPORT, report.join("\n") + "\n");
    expect(report).toEqual([]);
  });
});
