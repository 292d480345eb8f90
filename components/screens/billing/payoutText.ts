import { payoutStatusLabel } from "../../../shared/billing";
import { day, money } from "./parts";

/** Fees and refunds take money off: shown with a minus, and zero as zero. */
export const minus = (cents: number, currency: string) => (cents ? money(-Math.abs(cents), currency) : money(0, currency));

/** "Arrived Mar 2, 2026", or "In transit · due Mar 2, 2026". */
export const arrival = (status: string, date: string) => (status === "paid" ? `Arrived ${day(date)}` : `${payoutStatusLabel(status)} · due ${day(date)}`);

/** A payout transaction's type, in the bookkeeper's words. */
export const TXN_TYPE: Record<string, string> = { charge: "Card payment", payment: "Card payment", refund: "Refund", adjustment: "Adjustment", stripe_fee: "Processor fee" };

/** What a transaction did: money received, money refunded, or the processor's own line. */
export const AMOUNT_LABEL: Record<string, string> = { charge: "Received", payment: "Received", refund: "Refunded" };
