import { allergenStatement } from "../../shared/allergens";
import { formatterFor } from "../../shared/format";
import { quantityText } from "../../shared/quantity";

/** E-mail bodies: every mail has an HTML and a plain-text part saying the same thing. */
const escapeHtml = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");

interface Rendered {
  subject: string;
  html: string;
  text: string;
}

function layout(bakeryName: string, heading: string, paragraphs: string[], action?: { label: string; url: string }, footer?: string): Omit<Rendered, "subject"> {
  const htmlParas = paragraphs.map((p) => `<p style="margin:0 0 14px;font-size:16px;line-height:1.5">${escapeHtml(p)}</p>`).join("");
  const button = action
    ? `<p style="margin:22px 0"><a href="${escapeHtml(action.url)}" style="background:#8A3F12;color:#ffffff;padding:12px 20px;border-radius:10px;text-decoration:none;font-weight:bold;display:inline-block">${escapeHtml(action.label)}</a></p>
       <p style="margin:0 0 14px;font-size:13px;color:#5E5247">Or paste this link into your browser: <br>${escapeHtml(action.url)}</p>`
    : "";
  const html = `<!doctype html><html><body style="margin:0;background:#FAF6EF;font-family:Helvetica,Arial,sans-serif;color:#2A211B">
<div style="max-width:560px;margin:0 auto;padding:28px 22px">
<p style="margin:0 0 18px;font-weight:bold;color:#8A3F12;letter-spacing:0.5px">${escapeHtml(bakeryName)}</p>
<h1 style="font-size:22px;margin:0 0 16px">${escapeHtml(heading)}</h1>
${htmlParas}${button}
${footer ? `<p style="margin:24px 0 0;font-size:13px;color:#5E5247">${escapeHtml(footer)}</p>` : ""}
<p style="margin:24px 0 0;font-size:12px;color:#5E5247">Sent by Panwise for ${escapeHtml(bakeryName)}.</p>
</div></body></html>`;
  const text = [bakeryName, "", heading, "", ...paragraphs.flatMap((p) => [p, ""]), ...(action ? [`${action.label}: ${action.url}`, ""] : []), ...(footer ? [footer, ""] : []), `Sent by Panwise for ${bakeryName}.`].join("\n");
  return { html, text };
}

export function invitationMail(p: { bakeryName: string; roleLabel: string; accountName: string | null; url: string; inviterName: string }): Rendered {
  const forWhom = p.accountName ? ` for ${p.accountName}` : "";
  return {
    subject: p.accountName ? `You're invited to order from ${p.bakeryName}` : `You're invited to join ${p.bakeryName} on Panwise`,
    ...layout(
      p.bakeryName,
      `You're invited to Panwise`,
      [
        `${p.inviterName} has invited you to ${p.bakeryName} on Panwise as ${p.roleLabel}${forWhom}.`,
        "Choose a password to finish setting up your sign-in. The link works once and expires in 72 hours.",
      ],
      { label: "Set your password", url: p.url },
      "If you weren't expecting this, you can ignore this e-mail.",
    ),
  };
}

export function passwordResetMail(p: { bakeryName: string; name: string; url: string }): Rendered {
  return {
    subject: `Reset your ${p.bakeryName} password`,
    ...layout(
      p.bakeryName,
      "Reset your password",
      [`Hello ${p.name},`, "Someone asked to reset the password for your Panwise sign-in. The link works once and expires in 1 hour."],
      { label: "Choose a new password", url: p.url },
      "If it wasn't you, ignore this e-mail: your password stays as it is.",
    ),
  };
}

export function orderMail(p: {
  bakeryName: string;
  currency: string;
  timeZone: string;
  /** The bakery's locale (dates, times and amounts are written in it); en-US when left out. */
  locale?: string;
  kind: "placed" | "changed" | "cancelled";
  url: string;
  order: import("../../shared/schemas/orders").OrderDto;
}): Rendered {
  const { order } = p;
  const f = formatterFor(p.locale, p.timeZone);
  const money = (c: number) => f.money(c, p.currency);
  const day = f.day(order.deliveryDate, "dayLong");
  const cutoff = f.at(order.cutoffAt, "dayTimeZone");
  const verb = { placed: "Order placed", changed: "Order changed", cancelled: "Order canceled" }[p.kind];
  // Each line names its allergens (the product's declaration: formula, components and its own), as US FALCPA (as amended
  // by the FASTER Act of 2021) and EU Regulation 1169/2011 Annex II list them.
  const lines = order.lines.map((l) => `${l.productName} — ${quantityText(l.quantity, l)} — ${money(l.lineTotalCents)}. ${allergenStatement(l.allergens, l.mayContain)}`);
  const paras =
    p.kind === "cancelled"
      ? [`Your order for ${day} (${order.accountName}) is canceled. Nothing will be delivered that day.`]
      : [
          `${order.accountName}, delivery ${day}:`,
          ...lines,
          `Total ${money(order.totalCents)}${order.poNumber ? ` · PO ${order.poNumber}` : ""}`,
          `You can change it until the cut-off, ${cutoff}.`,
        ];
  return { subject: `${verb}: ${day} — ${p.bakeryName}`, ...layout(p.bakeryName, verb, paras, { label: "View the order", url: p.url }, "Allergens are listed with each line above and on each product in Panwise; ask the bakery if you have a severe allergy.") };
}

export function invoiceMail(p: { bakeryName: string; currency: string; locale?: string; number: string; totalCents: number; dueCents: number; dueDate: string; url: string; card: boolean; instructions: string; statement?: boolean }): Rendered {
  const f = formatterFor(p.locale);
  // A statement is called "Weekly statement" on the screen, on its PDF and here (issue 10).
  const what = p.statement ? "Weekly statement" : "Invoice";
  const money = (c: number) => f.money(c, p.currency);
  const due = f.day(p.dueDate, "dayWithYear");
  const paras = [
    `${what} ${p.number} for ${money(p.totalCents)} is attached as a PDF.`,
    p.dueCents > 0 ? `${money(p.dueCents)} is due by ${due}.` : "Nothing is due: it is settled.",
    p.card ? "You can pay it by card in Panwise." : p.instructions || "Please pay by bank transfer or check, quoting the invoice number.",
  ];
  return { subject: `${what} ${p.number} from ${p.bakeryName}`, ...layout(p.bakeryName, `${what} ${p.number}`, paras, { label: p.card && p.dueCents > 0 ? "View and pay" : "View the invoice", url: p.url }) };
}

export function receiptMail(p: { bakeryName: string; currency: string; locale?: string; number: string; amountCents: number; method: string; url: string }): Rendered {
  const money = (c: number) => formatterFor(p.locale).money(c, p.currency);
  return { subject: `Payment received for ${p.number} — ${p.bakeryName}`, ...layout(p.bakeryName, "Payment received", [`Thank you: we received ${money(p.amountCents)} (${p.method}) for invoice ${p.number}.`], { label: "View the invoice", url: p.url }) };
}

/** A payment reminder for one invoice: what is owed and by when (or since when), how to pay, and "ignore if paid". */
export function reminderMail(p: { bakeryName: string; currency: string; locale?: string; number: string; totalCents: number; dueCents: number; dueDate: string; today: string; url: string; card: boolean; instructions: string; statement?: boolean }): Rendered {
  const f = formatterFor(p.locale);
  const what = p.statement ? "Weekly statement" : "Invoice";
  const money = (c: number) => f.money(c, p.currency);
  const due = f.day(p.dueDate, "dayWithYear");
  const late = p.dueDate < p.today;
  const paras = [
    late ? `${what} ${p.number} was due on ${due}, and ${money(p.dueCents)} of it is still unpaid.` : `${what} ${p.number}: ${money(p.dueCents)} is due by ${due}.`,
    p.card ? "You can pay it by card in Panwise." : p.instructions || "Please pay by bank transfer or check, quoting the invoice number.",
    "If you have paid it already, thank you, and please ignore this reminder.",
  ];
  return { subject: `Payment reminder: ${what.toLowerCase()} ${p.number} from ${p.bakeryName}`, ...layout(p.bakeryName, `Payment reminder: ${what} ${p.number}`, paras, { label: p.card ? "View and pay" : "View the invoice", url: p.url }) };
}
