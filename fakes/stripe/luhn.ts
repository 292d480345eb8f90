/**
 * Card-number checks for the hosted payment page.
 *
 * The check digit is the Luhn "mod 10" algorithm of ISO/IEC 7812-1 (Annex B): from the rightmost
 * digit (the check digit) leftwards, double every second digit, subtract 9 from any result above 9,
 * and the sum of all digits must be a multiple of 10.
 *
 * The test numbers and their outcomes are Stripe's published test cards
 * (https://docs.stripe.com/testing, "Cards by brand" and "Declined payments").
 */

export function luhnValid(digits: string): boolean {
  if (!/^\d+$/.test(digits) || digits.length < 2) return false;
  let sum = 0;
  for (let i = digits.length - 1, double = false; i >= 0; i--, double = !double) {
    let d = digits.charCodeAt(i) - 48;
    if (double) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

/** Stripe's `payment_method_details.card.brand` values, from the issuer identification number. */
export type CardBrand = "amex" | "diners" | "discover" | "jcb" | "mastercard" | "unionpay" | "visa" | "unknown";

export function cardBrand(digits: string): CardBrand {
  const n2 = Number(digits.slice(0, 2));
  const n3 = Number(digits.slice(0, 3));
  const n4 = Number(digits.slice(0, 4));
  if (digits.startsWith("4")) return "visa";
  if ((n2 >= 51 && n2 <= 55) || (n4 >= 2221 && n4 <= 2720)) return "mastercard";
  if (n2 === 34 || n2 === 37) return "amex";
  if (n4 === 6011 || n2 === 65 || (n3 >= 644 && n3 <= 649)) return "discover";
  if (n2 === 35) return "jcb";
  if (n2 === 36 || n2 === 38 || n2 === 39 || (n3 >= 300 && n3 <= 305)) return "diners";
  if (n2 === 62 || n2 === 81) return "unionpay";
  return "unknown";
}

export interface Decline {
  /** Stripe error `code` (e.g. card_declined). */
  code: string;
  /** Stripe `decline_code`, only present for issuer declines. */
  declineCode?: string;
  /** The customer-facing message Stripe returns. */
  message: string;
}

/**
 * Stripe's published decline test cards. Every other Luhn-valid number succeeds (as in Stripe test mode).
 */
export const DECLINING_TEST_CARDS: Readonly<Record<string, Decline>> = {
  "4000000000000002": { code: "card_declined", declineCode: "generic_decline", message: "Your card was declined." },
  "4000000000009995": { code: "card_declined", declineCode: "insufficient_funds", message: "Your card has insufficient funds." },
  "4000000000009987": { code: "card_declined", declineCode: "lost_card", message: "Your card was declined." },
  "4000000000009979": { code: "card_declined", declineCode: "stolen_card", message: "Your card was declined." },
  "4000000000000069": { code: "expired_card", message: "Your card has expired." },
  "4000000000000127": { code: "incorrect_cvc", message: "Your card's security code is incorrect." },
  "4000000000000119": { code: "processing_error", message: "An error occurred while processing your card. Try again in a little bit." },
};

export function testCardOutcome(digits: string): Decline | null {
  return DECLINING_TEST_CARDS[digits] ?? null;
}

/** Keeps digits only, dropping the spaces and dashes people type between groups. */
export function normaliseCardNumber(input: string): string | null {
  const compact = input.replace(/[\s-]/g, "");
  return /^\d*$/.test(compact) ? compact : null;
}
