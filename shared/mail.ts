/**
 * The kinds of e-mail the server queues (server/mail/outbox.service.ts `enqueueMail`), and what a person reads
 * for each on the outgoing e-mail screen. A kind is a stored code; it never reaches a person as written.
 */
export const MAIL_KINDS = ["invoice", "receipt", "reminder", "invitation", "password_reset", "order_placed", "order_changed", "order_cancelled"] as const;
export type MailKind = (typeof MAIL_KINDS)[number];
export const MAIL_KIND_LABELS: Record<MailKind, string> = {
  invoice: "Invoice",
  receipt: "Receipt",
  reminder: "Payment reminder",
  invitation: "Invitation",
  password_reset: "Password reset",
  order_placed: "Order placed",
  order_changed: "Order changed",
  order_cancelled: "Order canceled",
};

/** The label of a stored kind; a kind this build does not know (an older or newer row) reads as plain "E-mail". */
export function mailKindLabel(kind: string): string {
  return (MAIL_KIND_LABELS as Record<string, string>)[kind] ?? "E-mail";
}

/**
 * Who sees which mail in the outbox. The owner sees all of it; the bookkeeper the mail that carries money — invoices
 * (statements are invoices), receipts and payment reminders — to see that it went out and send a failed one again. Invitations,
 * password resets and order e-mails stay the owner's (they carry sign-in links and the buyers' ordering).
 */
export const BOOKKEEPER_MAIL_KINDS: readonly MailKind[] = ["invoice", "receipt", "reminder"];

/** The kinds a role may see in the outbox; null: every kind. */
export function outboxKindsFor(role: "owner" | "bookkeeper"): readonly MailKind[] | null {
  return role === "owner" ? null : BOOKKEEPER_MAIL_KINDS;
}
