/**
 * The collectors of tests/shared/words.test.ts: every string the app and the server can show a person, read
 * from the source with the TypeScript compiler API, rendered from the mail templates and the payment page, and
 * read from the label maps at run time. The rules and the test are in words.test.ts.
 */
import fs from "node:fs";
import path from "node:path";
import ts from "typescript";

export const ROOT = path.resolve(__dirname, "../..");

export interface Word {
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
export const VISIBLE_ATTRS = new Set([
  "label", "title", "subtitle", "overline", "message", "hint", "placeholder", "accessibilityLabel", "accessibilityHint", "aria-label",
  "about", "text", "rowLabel", "confirmLabel", "cancelLabel", "emptyText", "caption", "description", "helper", "helperText", "error", "heading",
  "alt", "value-label", "tooltip", "retryLabel", "actionLabel", "linkLabel", "body", "note", "footerLabel", "unit", "suffix", "prefix",
]);
/** Object properties whose values people read (choices, columns, table rows, notices). */
export const VISIBLE_PROPS = new Set(["label", "title", "subtitle", "message", "hint", "text", "description", "heading", "caption", "overline", "confirmLabel", "reasonText", "detail", "summary"]);
/** Variables whose object values are labels. */
export const LABEL_MAP_NAME = /(?:^|_)(LABELS?|HINTS?|TITLES?|TEXTS?|MESSAGES?|WORDS|CAUTIONS?|FOOTNOTE)$|^(TXN_TYPE|AMOUNT_LABEL)$/;
/** Calls that put a sentence on the screen as a notice. */
export const NOTICE_CALL = /^set(Saved|Done|Notice|Resent|Note|Message|Info|Flash|Toast)$/;

export function walkFiles(dir: string, ext: RegExp): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...walkFiles(rel, ext));
    else if (ext.test(e.name) && !e.name.endsWith(".d.ts")) out.push(rel);
  }
  return out;
}

export function parse(file: string): ts.SourceFile {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  return ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
}

export const lineOf = (sf: ts.SourceFile, n: ts.Node) => sf.getLineAndCharacterOfPosition(n.getStart(sf)).line + 1;

/**
 * The strings an expression can evaluate to, as far as they are written in it: literals, both arms of a ?:,
 * both sides of + ?? ||, array elements, template literals (with {…} for each hole, and the holes' own strings).
 * Calls are not followed (a formatter's argument is data), except .toLowerCase()/.trim() and friends.
 */
export type Add = (text: string, node: ts.Node, interpolated?: string[], fragment?: boolean) => void;
export function leaves(sf: ts.SourceFile, e: ts.Node | undefined, add: Add, fragment = false): void {
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

export function attrName(a: ts.JsxAttribute): string {
  return ts.isIdentifier(a.name) ? a.name.text : a.name.getText();
}

/** Screens: JSX text, visible attributes, expression children, visible properties, label maps, notices. */
export function collectScreens(files: string[]): Word[] {
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

export const ZOD_METHODS = new Set(["min", "max", "length", "regex", "email", "url", "int", "positive", "nonnegative", "negative", "nonpositive", "nonempty", "gte", "lte", "gt", "lt", "multipleOf", "finite", "refine", "datetime", "uuid", "includes"]);
export const ERROR_HELPERS = new Set(["badRequest", "conflict", "forbidden", "unauthorized"]);

/** Server and shared source: HttpError messages, zod messages, and (shared) visible properties. */
export function collectSource(files: string[], source: string, opts: { errors: boolean; zod: boolean; props: boolean }): Word[] {
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
export function collectLiterals(file: string, source: string): Word[] {
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

export const stripHtml = (html: string) =>
  html.replace(/<style[\s\S]*?<\/style>/g, " ").replace(/<[^>]+>/g, "\n").replace(/&amp;/g, "&").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&#39;/g, "'")
    .split("\n").map((s) => s.replace(/\s+/g, " ").trim()).filter(Boolean);

/** Every template in server/mail/templates.ts, called with a sample that has what any of them asks for. */
export async function collectMails(): Promise<Word[]> {
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
export async function collectPayPage(): Promise<Word[]> {
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
export async function collectSharedLabels(): Promise<Word[]> {
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
