import express, { type Request, type Response } from "express";
import type { CardInput, FakeAccount } from "./account";
import type { Store } from "./store";
import { luhnValid, normaliseCardNumber } from "./luhn";
import { messagePage, payPage, type PayField, type PayFormValues } from "./pages";

/**
 * Panwise's local test payment page, where a Checkout Session's `url` points: GET shows what is paid and
 * a card form, POST checks it (Luhn, expiry, CVC), then pays or shows the bank's decline in our words.
 */

export interface CardCheck {
  card: CardInput | null;
  errors: Partial<Record<PayField, string>>;
}

/**
 * Checks the form before any charge, with Panwise's own messages: the card number by length (ISO/IEC 7812-1:
 * 8 to 19 digits; Panwise asks for at least 12, as no payment card in use is shorter, from memory) and check
 * digit (Luhn, luhn.ts), the expiry (a card is valid through the last day of its month, from memory), the CVC
 * (3 digits, 4 on American Express, from memory). `now` is used for the expiry check.
 */
export function checkCard(values: PayFormValues, askEmail: boolean, now: Date): CardCheck {
  const errors: Partial<Record<PayField, string>> = {};
  const email = values.email.trim();
  if (askEmail && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email)) errors.email = email ? "That e-mail address looks incomplete — it needs a name, an @ and a domain, like name@example.com." : "Enter the e-mail address the receipt should go to.";

  const digits = normaliseCardNumber(values.card_number);
  if (!values.card_number.trim()) errors.card_number = "Enter the card number from the front of the card.";
  else if (digits === null) errors.card_number = "The card number is digits only — take out any letters or signs.";
  else if (digits.length > 19) errors.card_number = "The card number is too long — check the digits.";
  else if (digits.length < 12) errors.card_number = "The card number is too short — check the digits.";
  else if (!luhnValid(digits)) errors.card_number = "That card number does not add up — a digit may be mistyped or two swapped.";

  let expMonth = 0;
  let expYear = 0;
  const exp = /^\s*(\d{1,2})\s*\/?\s*(\d{2}|\d{4})\s*$/.exec(values.expiry);
  if (!values.expiry.trim()) errors.expiry = "Enter the expiry date printed on the card.";
  else if (!exp) errors.expiry = "Write the expiry date as month and year, like 08/29.";
  else {
    expMonth = Number(exp[1]);
    expYear = exp[2]!.length === 2 ? 2000 + Number(exp[2]) : Number(exp[2]);
    const y = now.getUTCFullYear();
    const m = now.getUTCMonth() + 1;
    if (expMonth < 1 || expMonth > 12) errors.expiry = "The month of the expiry date goes from 01 to 12.";
    else if (expYear < y || (expYear === y && expMonth < m)) errors.expiry = `This card ran out at the end of ${String(expMonth).padStart(2, "0")}/${expYear} — use a card that is still valid.`;
    else if (expYear > y + 50) errors.expiry = "That expiry year is too far ahead — check the year.";
  }

  if (!values.cvc.trim()) errors.cvc = "Enter the security code (3 or 4 digits on the card).";
  else if (!/^\d{3,4}$/.test(values.cvc.trim())) errors.cvc = "The security code is 3 or 4 digits — check it on the card.";

  const name = values.name.trim();
  if (!name) errors.name = "Enter the name as it is printed on the card.";
  else if (name.length > 200) errors.name = "That name is longer than any card holds (200 characters at most).";

  const ok = Object.keys(errors).length === 0;
  return { errors, card: ok ? { number: digits!, expMonth, expYear, name, email } : null };
}

export function hostedRouter(deps: { account: FakeAccount; store: Store; nowMs: () => number }): express.Router {
  const { account, store } = deps;
  const router = express.Router();
  router.use((_req, res, next) => {
    res.set({
      "Cache-Control": "no-store",
      "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; img-src 'self'; base-uri 'none'; frame-ancestors 'none'",
      "Referrer-Policy": "no-referrer",
      "X-Content-Type-Options": "nosniff",
    });
    next();
  });
  router.use(express.urlencoded({ extended: false, limit: "16kb" }));

  const html = (res: Response, status: number, body: string) => void res.status(status).type("html").send(body);

  /** The session if it can still be paid; otherwise answers with the right page and returns null. */
  const openSession = (req: Request, res: Response, method: "GET" | "POST") => {
    if (account.expireDue()) store.save();
    const id = String(req.params.id);
    const session = store.get("checkoutSessions", id);
    if (!session) {
      html(res, 404, messagePage("Payment page not found", "No payment page lives at this address. Go back to the invoice and choose to pay by card again."));
      return null;
    }
    if (session.status === "expired") {
      html(res, 410, messagePage("This payment page has expired", "It was not used in time, and nothing was charged. Go back and start the payment again.", session.cancel_url ? { href: session.cancel_url, text: "Go back" } : undefined));
      return null;
    }
    if (session.status === "complete") {
      const success = session.success_url?.replace(/\{CHECKOUT_SESSION_ID\}|%7BCHECKOUT_SESSION_ID%7D/gi, session.id);
      html(res, method === "POST" ? 409 : 200, messagePage("Already paid", "This has already been paid. Nothing more was charged.", success ? { href: success, text: "Continue" } : undefined));
      return null;
    }
    return session;
  };

  const hasEmail = (session: { customer_email: string | null; customer: string | null }) =>
    Boolean(session.customer_email ?? (session.customer ? store.get("customers", session.customer)?.email : null));

  const emptyValues = (): PayFormValues => ({ email: "", name: "", card_number: "", expiry: "", cvc: "" });

  router.get("/:id", (req, res) => {
    const session = openSession(req, res, "GET");
    if (!session) return;
    const values = { ...emptyValues(), email: session.customer_email ?? "" };
    html(res, 200, payPage({ session, items: store.state.lineItems[session.id] ?? [], values, askEmail: !hasEmail(session), errors: {} }));
  });

  router.post("/:id", (req, res) => {
    const session = openSession(req, res, "POST");
    if (!session) return;
    const body = (req.body ?? {}) as Record<string, unknown>;
    const text = (k: PayField) => (typeof body[k] === "string" ? (body[k] as string) : "").slice(0, 300);
    const values: PayFormValues = { email: text("email"), name: text("name"), card_number: text("card_number"), expiry: text("expiry"), cvc: text("cvc") };
    const askEmail = !hasEmail(session);
    const items = store.state.lineItems[session.id] ?? [];
    const check = checkCard(values, askEmail, new Date(deps.nowMs()));
    if (!check.card) return html(res, 400, payPage({ session, items, values, askEmail, errors: check.errors }));

    const result = account.pay(session.id, check.card);
    store.save();
    if (!result.ok) return html(res, 402, payPage({ session, items, values, askEmail, errors: {}, decline: result.decline }));
    if (result.redirectTo) return void res.redirect(303, result.redirectTo);
    html(res, 200, messagePage("Payment received", "Thank you — the payment went through."));
  });
  return router;
}
