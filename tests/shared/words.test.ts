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

const ROOT = path.resolve(__dirname, "../..");

interface Word {
  source: string;
  file: string;
  line: number;
  text: string;
  /** Expressions interpolated into it (`${…}`), as written in the source. */
  interpolated?: string[];
  /** A piece of a longer sentence (a ?: arm inside a template hole), not a whole string on its own. */
  fragment?: boolean;
}

// ---- collection ---------------------------------------------------------------------------------

/** JSX attributes a person sees or hears. testID, href, key, style, icon, name, tone, variant … are left out on purpose. */
const VISIBLE_ATTRS = new Set([
  "label", "title", "subtitle", "overline", "message", "hint", "placeholder", "accessibilityLabel", "accessibilityHint", "aria-label",
  "about", "text", "rowLabel", "confirmLabel", "cancelLabel", "emptyText", "caption", "description", "helper", "helperText", "error", "heading",
  "alt", "value-label", "tooltip", "retryLabel", "actionLabel", "linkLabel", "body", "note", "footerLabel", "unit", "suffix", "prefix",
]);
/** Object properties whose values people read (choices, columns, table rows, notices). */
const VISIBLE_PROPS = new Set(["label", "title", "subtitle", "message", "hint", "text", "description", "heading", "caption", "overline", "confirmLabel", "reasonText", "detail", "summary"]);
/** Variables whose object values are labels. */
const LABEL_MAP_NAME = /(?:^|_)(LABELS?|HINTS?|TITLES?|TEXTS?|MESSAGES?|WORDS|CAUTIONS?|FOOTNOTE)$|^(TXN_TYPE|AMOUNT_LABEL)$/;
/** Calls that put a sentence on the screen as a notice. */
const NOTICE_CALL = /^set(Saved|Done|Notice|Resent|Note|Message|Info|Flash|Toast)$/;

function walkFiles(dir: string, ext: RegExp): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...walkFiles(rel, ext));
    else if (ext.test(e.name) && !e.name.endsWith(".d.ts")) out.push(rel);
  }
  return out;
}

function parse(file: string): ts.SourceFile {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  return ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
}

const lineOf = (sf: ts.SourceFile, n: ts.Node) => sf.getLineAndCharacterOfPosition(n.getStart(sf)).line + 1;

/**
 * The strings an expression can evaluate to, as far as they are written in it: literals, both arms of a ?:,
 * both sides of + ?? ||, array elements, template literals (with {…} for each hole, and the holes' own strings).
 * Calls are not followed (a formatter's argument is data), except .toLowerCase()/.trim() and friends.
 */
type Add = (text: string, node: ts.Node, interpolated?: string[], fragment?: boolean) => void;
function leaves(sf: ts.SourceFile, e: ts.Node | undefined, add: Add, fragment = false): void {
  if (!e) return;
  if (ts.isStringLiteral(e) || ts.isNoSubstitutionTemplateLiteral(e)) return add(e.text, e, undefined, fragment);
  if (ts.isTemplateExpression(e)) {
    let text = e.head.text;
    const holes: string[] = [];
    for (const span of e.templateSpans) {
      text += "{…}" + span.literal.text;
      holes.push(span.expression.getText(sf));
      leaves(sf, span.expression, add, true);
    }
    return add(text, e, holes, fragment);
  }
  if (ts.isParenthesizedExpression(e) || ts.isAsExpression(e) || ts.isNonNullExpression(e) || ts.isSatisfiesExpression(e)) return leaves(sf, e.expression, add, fragment);
  if (ts.isConditionalExpression(e)) {
    leaves(sf, e.whenTrue, add, fragment);
    return leaves(sf, e.whenFalse, add, fragment);
  }
  if (ts.isBinaryExpression(e)) {
    const op = e.operatorToken.kind;
    if (op === ts.SyntaxKind.PlusToken || op === ts.SyntaxKind.QuestionQuestionToken || op === ts.SyntaxKind.BarBarToken) {
      const part = fragment || op === ts.SyntaxKind.PlusToken;
      leaves(sf, e.left, add, part);
      leaves(sf, e.right, add, part);
    } else if (op === ts.SyntaxKind.AmpersandAmpersandToken) leaves(sf, e.right, add, fragment);
    return;
  }
  if (ts.isArrayLiteralExpression(e)) return e.elements.forEach((x) => leaves(sf, x, add, fragment));
  if (ts.isCallExpression(e) && ts.isPropertyAccessExpression(e.expression) && /^(toLowerCase|toUpperCase|trim|toLocaleLowerCase|toLocaleUpperCase)$/.test(e.expression.name.text)) {
    return leaves(sf, e.expression.expression, add, fragment);
  }
  if (ts.isArrowFunction(e) && !ts.isBlock(e.body)) return leaves(sf, e.body, add, fragment);
  // A bare field interpolated or rendered as is: record it so the raw-code rule can see `{o.status}`.
  if (ts.isPropertyAccessExpression(e) || ts.isElementAccessExpression(e)) add("{…}", e, [e.getText(sf)], fragment);
}

function attrName(a: ts.JsxAttribute): string {
  return ts.isIdentifier(a.name) ? a.name.text : a.name.getText();
}

/** Screens: JSX text, visible attributes, expression children, visible properties, label maps, notices. */
function collectScreens(files: string[]): Word[] {
  const out: Word[] = [];
  for (const file of files) {
    const sf = parse(file);
    const add: Add = (text, node, interpolated, fragment) => out.push({ source: "screens", file, line: lineOf(sf, node), text, interpolated, fragment });
    const visit = (n: ts.Node): void => {
      if (ts.isJsxText(n)) {
        const t = n.text.replace(/\s+/g, " ").trim();
        if (t) add(t, n);
      } else if (ts.isJsxAttribute(n) && VISIBLE_ATTRS.has(attrName(n)) && n.initializer) {
        if (ts.isStringLiteral(n.initializer)) add(n.initializer.text, n.initializer);
        else if (ts.isJsxExpression(n.initializer)) leaves(sf, n.initializer.expression, add);
      } else if (ts.isJsxExpression(n) && n.parent && (ts.isJsxElement(n.parent) || ts.isJsxFragment(n.parent))) {
        leaves(sf, n.expression, add);
      } else if (ts.isPropertyAssignment(n) && VISIBLE_PROPS.has(n.name.getText(sf).replace(/["']/g, ""))) {
        leaves(sf, n.initializer, add);
      } else if (ts.isVariableDeclaration(n) && ts.isIdentifier(n.name) && LABEL_MAP_NAME.test(n.name.text) && n.initializer) {
        const init = ts.isAsExpression(n.initializer) || ts.isSatisfiesExpression(n.initializer) ? n.initializer.expression : n.initializer;
        if (ts.isObjectLiteralExpression(init)) for (const p of init.properties) if (ts.isPropertyAssignment(p)) leaves(sf, p.initializer, add);
      } else if (ts.isCallExpression(n) && ts.isIdentifier(n.expression) && NOTICE_CALL.test(n.expression.text)) {
        n.arguments.forEach((a) => leaves(sf, a, add));
      }
      ts.forEachChild(n, visit);
    };
    visit(sf);
  }
  return out;
}

const ZOD_METHODS = new Set(["min", "max", "length", "regex", "email", "url", "int", "positive", "nonnegative", "negative", "nonpositive", "nonempty", "gte", "lte", "gt", "lt", "multipleOf", "finite", "refine", "datetime", "uuid", "includes"]);
const ERROR_HELPERS = new Set(["badRequest", "conflict", "forbidden", "unauthorized"]);

/** Server and shared source: HttpError messages, zod messages, and (shared) visible properties. */
function collectSource(files: string[], source: string, opts: { errors: boolean; zod: boolean; props: boolean }): Word[] {
  const out: Word[] = [];
  for (const file of files) {
    const sf = parse(file);
    const usesZod = /from "zod"/.test(sf.text);
    const add: Add = (text, node, interpolated, fragment) => out.push({ source, file, line: lineOf(sf, node), text, interpolated, fragment });
    const visit = (n: ts.Node): void => {
      if (opts.errors && ts.isNewExpression(n) && ts.isIdentifier(n.expression) && n.expression.text === "HttpError" && n.arguments?.[2]) leaves(sf, n.arguments[2], add);
      if (opts.errors && ts.isCallExpression(n) && ts.isIdentifier(n.expression) && ERROR_HELPERS.has(n.expression.text)) {
        const msg = n.expression.text === "conflict" ? n.arguments[1] : n.arguments[0];
        leaves(sf, msg, add);
      }
      if (opts.zod && usesZod) {
        if (ts.isPropertyAssignment(n) && /^(message|required_error|invalid_type_error|description)$/.test(n.name.getText(sf))) leaves(sf, n.initializer, add);
        if (ts.isCallExpression(n) && ts.isPropertyAccessExpression(n.expression) && ZOD_METHODS.has(n.expression.name.text)) {
          for (const a of n.arguments) if (ts.isStringLiteral(a) || ts.isTemplateExpression(a) || ts.isNoSubstitutionTemplateLiteral(a)) leaves(sf, a, add);
        }
      }
      if (opts.props && ts.isPropertyAssignment(n) && VISIBLE_PROPS.has(n.name.getText(sf))) leaves(sf, n.initializer, add);
      if (opts.props && ts.isVariableDeclaration(n) && ts.isIdentifier(n.name) && /^[A-Z][A-Z_]+$/.test(n.name.text) && n.initializer && (ts.isStringLiteral(n.initializer) || ts.isTemplateExpression(n.initializer) || ts.isNoSubstitutionTemplateLiteral(n.initializer)) && /[a-z] [a-z]/.test(n.initializer.getText(sf))) {
        leaves(sf, n.initializer, add);
      }
      ts.forEachChild(n, visit);
    };
    visit(sf);
  }
  return out;
}

/** Every string literal of a file that reads as words (PDF layout code: fonts, colors and option keys are left out). */
function collectLiterals(file: string, source: string): Word[] {
  const out: Word[] = [];
  const sf = parse(file);
  const skipCall = /^(font|fillColor|strokeColor|require|on|registerFont|lineCap|dash)$/;
  const visit = (n: ts.Node): void => {
    if (ts.isImportDeclaration(n) || ts.isExportDeclaration(n)) return;
    if (ts.isCallExpression(n) && ts.isPropertyAccessExpression(n.expression) && skipCall.test(n.expression.name.text)) return;
    if (ts.isPropertyAssignment(n) && /^(align|size|margin|font|color|Creator|lineBreak)$/.test(n.name.getText(sf))) return;
    if (ts.isStringLiteral(n) || ts.isNoSubstitutionTemplateLiteral(n) || ts.isTemplateExpression(n)) {
      leaves(sf, n, (text, node, interpolated, fragment) => {
        if (/[A-Za-z]{2}/.test(text) && !/^#|^Helvetica/.test(text) && (/[A-Z ]/.test(text) || /\{…\}/.test(text))) out.push({ source, file, line: lineOf(sf, node), text, interpolated, fragment });
      });
      return;
    }
    ts.forEachChild(n, visit);
  };
  visit(sf);
  return out;
}

const stripHtml = (html: string) =>
  html.replace(/<style[\s\S]*?<\/style>/g, " ").replace(/<[^>]+>/g, "\n").replace(/&amp;/g, "&").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&#39;/g, "'")
    .split("\n").map((s) => s.replace(/\s+/g, " ").trim()).filter(Boolean);

/** Every template in server/mail/templates.ts, called with a sample that has what any of them asks for. */
async function collectMails(): Promise<Word[]> {
  const templates = (await import("../../server/mail/templates")) as unknown as Record<string, unknown>;
  const order = {
    id: 1, accountId: 1, accountName: "Sample Account", deliveryDate: "2026-06-09", status: "open", poNumber: "PO 7", note: null, totalCents: 5400,
    cutoffAt: "2026-06-08T14:00:00-05:00", source: "one_off", editedByHand: false, createdAt: "2026-06-01T10:00:00Z", updatedAt: "2026-06-01T10:00:00Z",
    lines: [{ productId: 1, productName: "Dinner rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", quantity: 3, unitPriceCents: 1800, lineTotalCents: 5400, allergens: ["wheat", "milk"], mayContain: "sesame" }],
  };
  const base = {
    bakeryName: "Sample Bakery", currency: "USD", timeZone: "America/Chicago", locale: "en-US", number: "SB-2026-00001", totalCents: 5400, dueCents: 5400, amountCents: 5400,
    dueDate: "2026-06-16", url: "http://localhost/x", instructions: "", roleLabel: "bookkeeper", accountName: "Sample Account", inviterName: "Sam Owner", name: "Sam",
    method: "card", kind: "placed", order,
  };
  const variants: Record<string, unknown>[] = [
    ...["placed", "changed", "cancelled"].map((kind) => ({ ...base, kind })),
    { ...base, card: true }, { ...base, card: false }, { ...base, card: false, dueCents: 0, accountName: null },
  ];
  const out: Word[] = [];
  for (const [name, fn] of Object.entries(templates)) {
    if (typeof fn !== "function" || !/Mail$/.test(name)) continue;
    for (const v of variants) {
      const r = (fn as (p: unknown) => { subject: string; text: string; html: string })(v);
      const file = `server/mail/templates.ts ${name}`;
      out.push({ source: "e-mails", file, line: 0, text: r.subject });
      for (const t of r.text.split("\n").filter((s) => s.trim())) out.push({ source: "e-mails", file, line: 0, text: t });
      for (const t of stripHtml(r.html)) out.push({ source: "e-mails", file, line: 0, text: t });
    }
  }
  return out;
}

/** The local payment page: rendered with every field error checkCard gives and with every decline. */
async function collectPayPage(): Promise<Word[]> {
  const { payPage, DECLINE_WORDS } = await import("../../fakes/stripe/pages");
  const { checkCard } = await import("../../fakes/stripe/hosted");
  const now = new Date("2026-06-09T12:00:00Z");
  const good = { email: "a@b.test", card_number: "4242 4242 4242 4242", expiry: "08/29", cvc: "123", name: "A Buyer" };
  const bad = [
    { email: "", card_number: "", expiry: "", cvc: "", name: "" },
    { email: "nope", card_number: "4242 42x", expiry: "8-29", cvc: "12", name: "x".repeat(201) },
    { ...good, card_number: "4242 4242", expiry: "01/20" },
    { ...good, card_number: "4242 4242 4242 4242 4242 4242", expiry: "13/29" },
    { ...good, card_number: "4242 4242 4242 4241", expiry: "08/99" },
  ];
  const session = { id: "cs_test_1", amount_total: 5400, currency: "usd", cancel_url: "http://localhost/back", metadata: { payee: "Sample Bakery" } };
  const items = [{ description: "Invoice SB-2026-00001", quantity: 1, currency: "usd", amount_total: 5400, price: { unit_amount: 5400 } }];
  const out: Word[] = [];
  const push = (html: string) => stripHtml(html).forEach((text) => out.push({ source: "payment page", file: "fakes/stripe/pages.ts payPage", line: 0, text }));
  for (const values of bad) push(payPage({ session, items, values, askEmail: true, errors: checkCard(values, true, now).errors } as never));
  for (const code of Object.keys(DECLINE_WORDS)) push(payPage({ session, items, values: good, askEmail: false, errors: {}, decline: { code: "card_declined", declineCode: code } } as never));
  // The message pages (not found, expired, already paid, paid): the literal arguments of messagePage in hosted.ts.
  const sf = parse("fakes/stripe/hosted.ts");
  const visit = (n: ts.Node): void => {
    if (ts.isCallExpression(n) && ts.isIdentifier(n.expression) && n.expression.text === "messagePage") {
      n.arguments.forEach((a) => leaves(sf, a, (text, node) => out.push({ source: "payment page", file: "fakes/stripe/hosted.ts", line: lineOf(sf, node), text })));
    }
    if (ts.isPropertyAssignment(n) && n.name.getText(sf) === "text") leaves(sf, n.initializer, (text, node) => out.push({ source: "payment page", file: "fakes/stripe/hosted.ts", line: lineOf(sf, node), text }));
    ts.forEachChild(n, visit);
  };
  visit(sf);
  return out;
}

/** Label maps and visible constants of shared/, at run time (whatever builds them). */
async function collectSharedLabels(): Promise<Word[]> {
  const out: Word[] = [];
  for (const file of walkFiles("shared", /\.ts$/)) {
    const mod = (await import(path.join(ROOT, file))) as Record<string, unknown>;
    for (const [name, v] of Object.entries(mod)) {
      if (!LABEL_MAP_NAME.test(name) && !/^ALLERGENS$|^PRODUCTION_CAUTIONS$/.test(name)) continue;
      // A label map's values are all words; in an array of records (ALLERGENS, PRODUCTION_CAUTIONS) only the visible properties.
      const put = (x: unknown, whole: boolean): void => {
        if (typeof x === "string") out.push({ source: "shared labels", file: `${file} ${name}`, line: 0, text: x });
        else if (Array.isArray(x)) x.forEach((y) => put(y, false));
        else if (x && typeof x === "object") for (const [k, y] of Object.entries(x)) if (whole || VISIBLE_PROPS.has(k)) put(y, false);
      };
      put(v, true);
    }
  }
  return out;
}

// ---- the rules --------------------------------------------------------------------------------------

/**
 * Rule 1, raw codes (issue 10 "No raw codes reach a person"): a code is what the server stores — the enums of
 * shared/ (order and account statuses, roles, payment terms, invoice statuses and kinds, payment methods, payout
 * statuses, mail kinds, step and ingredient kinds) — plus anything shaped like one: a snake_case word.
 */
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
