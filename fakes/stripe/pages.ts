import type { CheckoutSession, LineItem } from "./types";
import type { Decline } from "./luhn";

/**
 * Panwise's local test payment page (the page a Checkout Session's `url` points to): plain HTML, no
 * script, labelled fields, errors tied to their fields. Every word a person reads here is Panwise's own;
 * only the API's JSON keeps Stripe's codes and messages (the API contract the SDK relies on).
 */

export const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

export const money = (amount: number, currency: string) => new Intl.NumberFormat("en-US", { style: "currency", currency: currency.toUpperCase() }).format(amount / 100);

export interface PayFormValues {
  email: string;
  name: string;
  card_number: string;
  expiry: string;
  cvc: string;
}

export type PayField = keyof PayFormValues;

export const FIELD_ORDER: PayField[] = ["email", "card_number", "expiry", "cvc", "name"];

const STYLE = `
*{box-sizing:border-box}
body{margin:0;font:16px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:#1a1a1a;background:#f4f1ec}
.banner{margin:0;padding:.75rem 1rem;background:#fff3c4;border-bottom:3px dashed #8a6d00;color:#3d3000;text-align:center}
.banner strong{display:block}
main{max-width:30rem;margin:1.5rem auto;padding:1.5rem;background:#fff;border-radius:12px;box-shadow:0 1px 4px rgba(0,0,0,.12)}
h1{font-size:1.35rem;margin:0 0 .25rem;overflow-wrap:anywhere}
.payee{margin:0;color:#4a4a4a}
.total{font-size:1.75rem;font-weight:700;margin:.25rem 0 1rem}
table{width:100%;border-collapse:collapse;margin-bottom:1.25rem}
th,td{padding:.4rem 0;border-bottom:1px solid #e4e0d8;text-align:left;vertical-align:top}
td.num,th.num{text-align:right;white-space:nowrap;padding-left:.75rem}
caption{text-align:left;font-weight:600;padding-bottom:.25rem}
fieldset{border:0;padding:0;margin:0}
legend{font-weight:700;font-size:1.1rem;padding:0}
label{display:block;font-weight:600;margin-top:1rem}
.hint{display:block;font-weight:400;font-size:.9rem;color:#555}
input{display:block;width:100%;margin-top:.25rem;padding:.6rem .7rem;font:inherit;border:1px solid #8a8478;border-radius:6px}
input:focus{outline:3px solid #1f5fbf;outline-offset:1px}
input[aria-invalid=true]{border:2px solid #b00020}
.row{display:flex;gap:1rem}.row>div{flex:1}
.field-error{color:#b00020;font-weight:600;margin:.25rem 0 0}
.alert{border:2px solid #b00020;background:#fdecee;padding:.75rem 1rem;border-radius:8px;margin-bottom:1rem}
.alert h2{font-size:1rem;margin:0 0 .25rem}.alert ul{margin:.25rem 0 0;padding-left:1.25rem}.alert a{color:#8a0018}
button{margin-top:1.5rem;width:100%;padding:.8rem;font:inherit;font-weight:700;color:#fff;background:#1f5fbf;border:0;border-radius:6px;cursor:pointer}
button:focus{outline:3px solid #0b2f66;outline-offset:2px}
.back{display:inline-block;margin-top:1rem;color:#1f5fbf}
.note{margin-top:1.5rem;font-size:.85rem;color:#555;border-top:1px solid #e4e0d8;padding-top:.75rem}
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${esc(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<p class="banner" role="note" id="test-banner"><strong>Panwise local test payment page — no money moves.</strong> No card is charged and nothing leaves this computer.</p>
<main>
${body}
<p class="note">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is turned down; 4000 0000 0000 9995 has too little money on it. Any future expiry date and any 3 digits work.</p>
</main>
</body>
</html>`;
}

function itemsTable(items: LineItem[], session: CheckoutSession): string {
  const rows = items
    .map((li) => `<tr><td>${esc(li.description)}</td><td class="num">${li.quantity} × ${esc(money(li.price.unit_amount, li.currency))}</td><td class="num">${esc(money(li.amount_total, li.currency))}</td></tr>`)
    .join("");
  return `<table>
<caption>What you are paying for</caption>
<thead><tr><th scope="col">Item</th><th scope="col" class="num">Quantity</th><th scope="col" class="num">Amount</th></tr></thead>
<tbody>${rows}</tbody>
<tfoot><tr><th scope="row" colspan="2">Total due</th><td class="num"><strong>${esc(money(session.amount_total, session.currency))}</strong></td></tr></tfoot>
</table>`;
}

interface FieldSpec {
  label: string;
  hint?: string;
  autocomplete: string;
  inputmode?: string;
  type?: string;
  maxlength?: number;
}

const FIELDS: Record<PayField, FieldSpec> = {
  email: { label: "Email", hint: "Where the receipt goes", autocomplete: "email", type: "email" },
  // No placeholders: a label and a hint say what goes in (WCAG 2.1 SC 3.3.2 Labels or Instructions; a placeholder vanishes as one types).
  card_number: { label: "Card number", hint: "The long number on the front; spaces are fine.", autocomplete: "cc-number", inputmode: "numeric", maxlength: 23 },
  expiry: { label: "Expiry date", hint: "Month and year: MM/YY", autocomplete: "cc-exp", inputmode: "numeric", maxlength: 7 },
  cvc: { label: "Security code (CVC)", hint: "3 or 4 digits", autocomplete: "cc-csc", inputmode: "numeric", maxlength: 4 },
  name: { label: "Name on card", autocomplete: "cc-name" },
};

function field(name: PayField, values: PayFormValues, errors: Partial<Record<PayField, string>>): string {
  const f = FIELDS[name];
  const id = `f-${name}`;
  const err = errors[name];
  const described = [f.hint ? `${id}-hint` : "", err ? `${id}-error` : ""].filter(Boolean).join(" ");
  return `<div>
<label for="${id}">${esc(f.label)}${f.hint ? ` <span class="hint" id="${id}-hint">${esc(f.hint)}</span>` : ""}</label>
<input id="${id}" name="${name}" type="${f.type ?? "text"}" autocomplete="${f.autocomplete}" required value="${esc(values[name])}"${f.inputmode ? ` inputmode="${f.inputmode}"` : ""}${f.maxlength ? ` maxlength="${f.maxlength}"` : ""}${described ? ` aria-describedby="${described}"` : ""}${err ? ` aria-invalid="true"` : ""}>
${err ? `<p class="field-error" id="${id}-error">${esc(err)}</p>` : ""}
</div>`;
}

export interface PayPageInput {
  session: CheckoutSession;
  items: LineItem[];
  values: PayFormValues;
  /** Whether to ask for an e-mail (not when the session already has one). */
  askEmail: boolean;
  errors: Partial<Record<PayField, string>>;
  /** A decline from the card issuer, shown above the form in Panwise's words. */
  decline?: Decline;
}

/**
 * What the payer reads when the bank turns a card down, by Stripe's `decline_code` (issuer declines) or
 * error `code` (Stripe docs, "Error codes" and "Decline codes"). Lost and stolen cards get the general
 * sentence: Stripe's decline-code docs advise not telling the payer that a card was reported (from memory).
 */
export const DECLINE_WORDS: Readonly<Record<string, string>> = {
  generic_decline: "The card's bank turned this payment down without saying why. Nothing was taken. Try another card, or ask your bank about it.",
  card_declined: "The card's bank turned this payment down without saying why. Nothing was taken. Try another card, or ask your bank about it.",
  insufficient_funds: "The card's bank turned this payment down: there is not enough money or credit on the card for this amount. Nothing was taken. Try another card.",
  lost_card: "The card's bank turned this payment down without saying why. Nothing was taken. Try another card, or ask your bank about it.",
  stolen_card: "The card's bank turned this payment down without saying why. Nothing was taken. Try another card, or ask your bank about it.",
  expired_card: "The card's bank says this card is no longer valid (past its expiry). Nothing was taken. Try a card that is still valid.",
  incorrect_cvc: "The card's bank says the security code does not match this card. Nothing was taken. Check the 3 or 4 digits and try again.",
  processing_error: "The card's bank could not handle the payment just now. Nothing was taken. Wait a minute and try again.",
};

export const declineWords = (d: Decline): string => DECLINE_WORDS[d.declineCode ?? ""] ?? DECLINE_WORDS[d.code] ?? DECLINE_WORDS.generic_decline!;

/**
 * What is paid and to whom, from what the seller sent when creating the session: the line item's name
 * (Panwise sends "Invoice HB-2026-00042") and the session's `metadata.payee` (Panwise sends the bakery's
 * name; real Stripe would use the account's business name, which the fake does not have).
 */
export function payHeading(session: CheckoutSession, items: LineItem[]): { what: string; payee: string | null } {
  const what = items.length === 1 ? items[0]!.description : items.length ? `${items.length} items` : "Your payment";
  const payee = session.metadata?.payee?.trim() || null;
  return { what, payee };
}

export function payPage(p: PayPageInput): string {
  const { session } = p;
  const errorList = FIELD_ORDER.filter((f) => p.errors[f]).map((f) => `<li><a href="#f-${f}">${esc(p.errors[f]!)}</a></li>`);
  const alert = p.decline
    ? `<div class="alert" role="alert" id="payment-error"><h2>The payment did not go through</h2><p>${esc(declineWords(p.decline))}</p></div>`
    : errorList.length
      ? `<div class="alert" role="alert"><h2>A few card details need another look</h2><ul>${errorList.join("")}</ul></div>`
      : "";
  const fields = (p.askEmail ? ["email" as const] : []).map((f) => field(f, p.values, p.errors)).join("") +
    field("card_number", p.values, p.errors) +
    `<div class="row">${field("expiry", p.values, p.errors)}${field("cvc", p.values, p.errors)}</div>` +
    field("name", p.values, p.errors);
  const back = session.cancel_url ? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>` : "";
  const { what, payee } = payHeading(session, p.items);
  const heading = payee ? `${what} — ${payee}` : what;
  return layout(
    `Pay ${heading} (test)`,
    `<h1 id="pay-heading">${esc(heading)}</h1>
${payee ? `<p class="payee">Paid to ${esc(payee)}</p>` : ""}
<p class="total">${esc(money(session.amount_total, session.currency))}</p>
${itemsTable(p.items, session)}
${alert}
<form method="post" action="/pay/${esc(session.id)}" novalidate>
<fieldset>
<legend>Card details</legend>
${fields}
</fieldset>
<button type="submit">Pay ${esc(money(session.amount_total, session.currency))}</button>
</form>
${back}`,
  );
}

export function messagePage(title: string, message: string, link?: { href: string; text: string }): string {
  return layout(title, `<h1>${esc(title)}</h1><p>${esc(message)}</p>${link ? `<a class="back" href="${esc(link.href)}">${esc(link.text)}</a>` : ""}`);
}
