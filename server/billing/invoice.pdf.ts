import PDFDocument from "pdfkit";
import type { Bakery } from "../bakery/bakery.entity";
import type { CustomerAccount } from "../accounts/account.entity";
import { formatterFor } from "../../shared/format";
import { PAYMENT_TERMS_LABELS, type PaymentTerms } from "../../shared/billing";
import type { invoiceDetail } from "./invoices.service";
import { PDF_FONT, PDF_FONT_BOLD, pdfText, useAppFonts } from "../pdf/fonts";

type Detail = Awaited<ReturnType<typeof invoiceDetail>>;
const INK = "#2A211B";
const MUTED = "#5E5247";
const CRUST = "#8A3F12";

/** The invoice as a PDF (pdfkit, in the app's Nunito): bakery, account, lines, tax, totals, credits, due date and how to pay. */
export function renderInvoicePdf(d: Detail & { bakery: Bakery; account: CustomerAccount }): Promise<Buffer> {
  const { invoice: inv, bakery, account } = d;
  const doc = new PDFDocument({ size: "LETTER", margin: 48, info: { Title: `Invoice ${inv.number}`, Author: bakery.name, Creator: "Panwise" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  useAppFonts(doc);
  const f = formatterFor(bakery.locale, bakery.timeZone);
  const money = (c: number) => f.money(c, inv.currency);
  const date = (iso: string) => f.day(iso.slice(0, 10), "date");
  const width = doc.page.width - 96;

  doc.font(PDF_FONT_BOLD).fontSize(18).fillColor(CRUST).text(pdfText(bakery.name));
  doc.font(PDF_FONT).fontSize(10).fillColor(MUTED).text(pdfText(bakery.address)).text(pdfText([bakery.phone, bakery.email].filter(Boolean).join(" · ")));
  doc.moveDown(1).fillColor(INK).font(PDF_FONT_BOLD).fontSize(22).text(inv.kind === "statement" ? "Weekly statement" : "Invoice");
  doc.font(PDF_FONT).fontSize(11)
    .text(`Number: ${inv.number}`)
    .text(`Issued: ${date(inv.issueDate)}    Due: ${date(inv.dueDate)}`)
    .text(inv.periodStart && inv.periodEnd ? `Deliveries ${date(inv.periodStart)} to ${date(inv.periodEnd)}` : "")
    .text(`Terms: ${PAYMENT_TERMS_LABELS[account.paymentTerms as PaymentTerms]}`);
  doc.moveDown(0.8).font(PDF_FONT_BOLD).text("Bill to");
  doc.font(PDF_FONT).text(pdfText(account.businessName)).text(pdfText(account.deliveryAddress)).text(account.billingEmail);
  doc.moveDown(0.8);

  const cols = [80, 230, 50, 76, 80];
  const row = (c: string[], bold = false) => {
    const y = doc.y;
    let x = 48;
    doc.font(bold ? PDF_FONT_BOLD : PDF_FONT).fontSize(10);
    let h = 0;
    c.forEach((t, i) => {
      doc.text(t, x, y, { width: cols[i] - 6, align: i >= 2 ? "right" : "left" });
      h = Math.max(h, doc.heightOfString(t, { width: cols[i] - 6 }));
      x += cols[i];
    });
    doc.x = 48;
    doc.y = y + h + 4;
    if (doc.y > doc.page.height - 120) doc.addPage();
  };
  row(["Delivered", "Item", "Qty", "Unit", "Amount"], true);
  doc.moveTo(48, doc.y).lineTo(48 + width, doc.y).strokeColor("#D9CBB8").stroke().moveDown(0.3);
  for (const l of d.lines) row([date(l.deliveryDate), pdfText(l.description), f.number(l.quantity), money(l.unitPriceCents), money(l.amountCents)]);
  doc.moveDown(0.5);
  const total = (label: string, value: string, bold = false) => {
    const y = doc.y;
    doc.font(bold ? PDF_FONT_BOLD : PDF_FONT).fontSize(bold ? 12 : 10).text(label, 48, y, { width: width - 110, align: "right" }).text(value, 48 + width - 110, y, { width: 110, align: "right" });
    doc.x = 48;
  };
  total("Subtotal", money(inv.subtotalCents));
  total(inv.taxExempt ? "Sales tax (exempt: certificate on file)" : `Sales tax ${f.number(inv.taxRateBp / 100, 2)} %`, money(inv.taxCents));
  total("Total", money(inv.totalCents), true);
  // An en dash before the amounts taken off (as the invoice has always printed them).
  for (const c of d.creditNotes) total(pdfText(`Credit note ${c.number}: ${c.reason}`), `– ${money(c.totalCents)}`);
  if (inv.paidCents) total("Paid", `– ${money(inv.paidCents)}`);
  if (inv.refundedCents) total("Refunded", money(inv.refundedCents));
  total(inv.amountDueCents ? "Amount due" : "Paid in full", money(inv.amountDueCents), true);

  doc.moveDown(1.2).font(PDF_FONT_BOLD).fontSize(11).text("How to pay");
  doc.font(PDF_FONT).fontSize(10).fillColor(INK)
    .text(account.paymentTerms === "card" ? "Pay by card from Panwise: open the invoice and choose Pay by card." : `Pay by ${date(inv.dueDate)}.`, { width })
    .text(pdfText(bakery.paymentInstructions) || "Bank transfer or check: quote the invoice number.", { width });
  doc.moveDown(0.6).fillColor(MUTED).fontSize(8.5).text("Amounts in " + inv.currency + ". Sales tax is worked out once on the subtotal and rounded half up to the cent.", { width });
  doc.end();
  return done;
}
