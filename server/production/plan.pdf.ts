import PDFDocument from "pdfkit";
import { formatterFor } from "../../shared/format";
import type { PlanDto } from "../../shared/schemas/production";
import { formatPercent, unitsFor, type UnitSystem } from "../../shared/units";
import { CAUTION_FOOTNOTE, dayCautions, liquidWarnings, mixLiquidAdvice, pasteCautionText } from "../../shared/cautions";
import { liquidNeedsAttention } from "../../shared/production";
import { PDF_FONT, PDF_FONT_BOLD, pdfText, useAppFonts, type PdfFont } from "../pdf/fonts";

const INK = "#2A211B";
const MUTED = "#5E5247";
const CRUST = "#8A3F12";
const ALERT = "#A3261B";
const RULE = "#D9CBB8";
const MARGIN = 40;
const BOTTOM = 48;

/**
 * The production sheet (overview, doughs, timeline, cautions) followed by one weigh-out card per mix, in large
 * type for a bakery wall. Letter size, in the app's Nunito (server/pdf/fonts.ts). Every piece of text is drawn inside a measured
 * box (an x and a width within the margins; its height from heightOfString before it is placed), so nothing
 * runs past the right margin or splits across a page: long names wrap inside their column. Numbers go through
 * shared/units.ts in the chosen system, the same formatting the screens use.
 */
export function renderPlanPdf(plan: PlanDto & { bakeryName: string; timeZone: string; locale?: string }, units: UnitSystem): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER", margin: MARGIN, info: { Title: `Production sheet ${plan.date}`, Author: plan.bakeryName, Creator: "Panwise" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  useAppFonts(doc);
  // Dates and times in the bakery's locale and zone (shared/format.ts), numbers in its locale too.
  const f = formatterFor(plan.locale, plan.timeZone);
  const u = unitsFor(units, f.locale);
  const time = (iso: string) => f.at(iso, "weekdayTime");
  const day = f.day(plan.date, "dayFull");
  const W = doc.page.width - 2 * MARGIN;
  const bottom = () => doc.page.height - BOTTOM;

  const ensure = (space: number) => {
    if (doc.y + space > bottom()) doc.addPage();
  };
  /** A paragraph in a measured box: wraps at `width`, never split across pages when it fits on one. */
  const para = (raw: string, o: { font?: PdfFont; size?: number; color?: string; x?: number; width?: number; gap?: number; spacing?: number } = {}) => {
    const text = pdfText(raw);
    const x = o.x ?? MARGIN;
    const width = Math.min(o.width ?? W, MARGIN + W - x);
    doc.font(o.font ?? PDF_FONT).fontSize(o.size ?? 10);
    const opts = { width, characterSpacing: o.spacing ?? 0 };
    const h = doc.heightOfString(text, opts);
    if (h <= bottom() - doc.page.margins.top) ensure(h);
    doc.fillColor(o.color ?? INK).text(text, x, doc.y, opts);
    doc.x = MARGIN;
    doc.y += o.gap ?? 2;
    doc.fillColor(INK);
  };
  const heading = (text: string, size = 16) => {
    doc.y += size * 0.5;
    para(text, { font: PDF_FONT_BOLD, size, color: CRUST });
  };
  const rule = () => {
    doc.moveTo(MARGIN, doc.y + 1).lineTo(MARGIN + W, doc.y + 1).strokeColor(RULE).lineWidth(1).stroke();
    doc.y += 4;
  };
  /** A table row: every cell measured in its column (width − 6 gutter), the row as high as its tallest cell. */
  const row = (raw: string[], widths: number[], o: { bold?: boolean; size?: number; left?: number[]; color?: string } = {}) => {
    const cols = raw.map(pdfText);
    doc.font(o.bold ? PDF_FONT_BOLD : PDF_FONT).fontSize(o.size ?? 10);
    const h = Math.max(...cols.map((c, i) => doc.heightOfString(c || " ", { width: widths[i] - 6 })));
    ensure(h + 3);
    const y = doc.y;
    let x = MARGIN;
    cols.forEach((c, i) => {
      const align = i === 0 || o.left?.includes(i) ? "left" : "right";
      doc.fillColor(o.color ?? INK).text(c, x, y, { width: widths[i] - 6, align });
      x += widths[i];
    });
    doc.fillColor(INK);
    doc.x = MARGIN;
    doc.y = y + h + 3;
  };
  /** Column widths as shares of the printable width (so a table always ends at the right margin). */
  const cols = (...shares: number[]) => {
    const total = shares.reduce((a, b) => a + b, 0);
    return shares.map((s) => (W * s) / total);
  };

  // ---- sheet -------------------------------------------------------------------------------
  para(plan.bakeryName.toUpperCase(), { font: PDF_FONT_BOLD, size: 11, color: CRUST, spacing: 1 });
  para(`Bake day: ${day}`, { font: PDF_FONT_BOLD, size: 24 });
  const frozen = plan.frozen ? `set at the cut-off ${plan.frozenAt ? f.at(plan.frozenAt, "dayTime") : ""}` : "not set yet: follows the orders until the cut-off";
  para(`Leaves at ${time(plan.inputs.dispatchAt)} · ${frozen} · ${plan.final ? "final" : "NOT FINAL: orders may still change until the cut-off"}`, { size: 11, color: MUTED });
  const supply = [plan.inputs.tapC !== undefined ? `tap water ${u.temp(plan.inputs.tapC)}` : "", plan.inputs.milkC !== undefined ? `milk ${u.temp(plan.inputs.milkC)}` : ""].filter(Boolean).join(" · ");
  para(
    `Room ${u.temp(plan.inputs.roomC)} · flour ${u.temp(plan.inputs.flourC)} · paste ${u.temp(plan.inputs.pasteC)}${supply ? ` · ${supply}` : ""} · largest mixer ${u.capacity(plan.inputs.mixerCapacityKg)}` +
      (plan.inputs.packingMinutes !== undefined && plan.inputs.packFrom ? ` · packing ${f.number(plan.inputs.packingMinutes)} min from ${time(plan.inputs.packFrom)}` : ""),
    { size: 11, color: MUTED },
  );

  heading("Pans", 18);
  for (const p of plan.products) {
    const nameX = MARGIN + 75;
    const detail = pdfText(`${p.panName} · ${f.number(p.units)} ordered${p.extraPans ? ` + ${u.count(p.extraPans, "extra pan", "extra pans")}` : ""} · ${u.count(p.pieces, "piece", "pieces")} of ${u.piece(p.pieceGrams)} scaled dough`);
    const name = pdfText(p.name);
    doc.font(PDF_FONT_BOLD).fontSize(13);
    const nameH = doc.heightOfString(name, { width: W - 75 });
    doc.font(PDF_FONT).fontSize(10);
    const detailH = doc.heightOfString(detail, { width: W - 75 });
    ensure(Math.max(34, nameH + detailH + 6));
    const y = doc.y;
    doc.font(PDF_FONT_BOLD).fontSize(28).fillColor(INK).text(f.number(p.pans), MARGIN, y, { width: 70, lineBreak: false });
    doc.font(PDF_FONT).fontSize(8).fillColor(MUTED).text(p.pans === 1 ? "pan" : "pans", MARGIN, y + 28, { width: 70, lineBreak: false });
    doc.font(PDF_FONT_BOLD).fontSize(13).fillColor(INK).text(name, nameX, y + 2, { width: W - 75 });
    doc.font(PDF_FONT).fontSize(10).fillColor(MUTED).text(detail, nameX, doc.y, { width: W - 75 });
    doc.fillColor(INK);
    doc.x = MARGIN;
    doc.y = Math.max(doc.y, y + 40) + 4;
  }
  const warnings = [...plan.warnings, ...liquidWarnings(plan, u)];
  if (warnings.length) {
    heading("Check", 13);
    for (const w of warnings) para(`• ${w}`);
  }

  for (const d of plan.doughs) {
    ensure(Math.min(70 + 15 * d.ingredients.length, 420)); // the dough's table on one page when it fits
    heading(`${d.name}: ${u.mass(d.doughGrams)} of dough (formula v${d.formulaVersion})`, 15);
    para(
      `Flour ${u.mass(d.flourGrams)}${d.paste ? ` · paste: ${u.mass(d.paste.flourGrams)} flour + ${u.mass(d.paste.liquidGrams)} liquid, cooked to ${u.temp(d.paste.cookToC)}` : ""} · ${u.count(d.mixes.length, "mix", "mixes")}${d.targetInternalC ? ` · done at ${u.temp(d.targetInternalC)} inside` : ""}`,
      { color: MUTED },
    );
    const widths = cols(36, 11, 18, 17, 18);
    row(["Ingredient", "%", "Total", "Paste", "Final mix"], widths, { bold: true });
    rule();
    for (const i of d.ingredients) row([i.name, formatPercent(i.percent, 2), u.mass(i.grams), i.pasteGrams ? u.mass(i.pasteGrams) : "—", u.mass(i.finalMixGrams)], widths);
  }

  ensure(120);
  heading("Timeline", 15);
  if (plan.schedule?.earlierStart) para(plan.schedule.earlierStart.text, { font: PDF_FONT_BOLD, size: 11, color: ALERT });
  const tw = cols(14, 14, 19, 53); // "Tue 11:50 PM" fits one line at 10 pt
  row(["Starts", "Ends", "Where", "Step"], tw, { bold: true, left: [1, 2, 3] });
  rule();
  for (const e of plan.timeline) {
    const names = plan.products.filter((p) => e.productIds.includes(p.productId)).map((p) => p.name).join(", ");
    const of = [e.mix ? `mix ${e.mix}` : "", e.load ? `oven load ${e.load}` : ""].filter(Boolean).join(", ");
    const pans = e.pans ? ` · ${u.count(e.pans, "pan", "pans")}` : "";
    row([time(e.startsAt), time(e.endsAt), e.resource?.name ?? "—", `${e.label}${e.temperatureC ? ` at ${u.temp(e.temperatureC)}` : ""}${of ? ` (${of})` : ""}${pans}${names ? `: ${names}` : ""}${e.note ? `. ${e.note}` : ""}`], tw, { left: [1, 2, 3] });
  }

  heading("Cautions", 13);
  for (const c of dayCautions(plan, u)) {
    if (c.key === "deferral") para(c.text, { font: PDF_FONT_BOLD, size: 9.5, gap: 4 });
    else para(`• ${c.title}: ${c.text}`, { size: 9.5, gap: 4 });
  }

  // ---- one card per mix ------------------------------------------------------------------------
  for (const d of plan.doughs) {
    const names = new Map(d.ingredients.map((i) => [i.ingredientId, i.name]));
    for (const m of d.mixes) {
      doc.addPage();
      para(`${day} · ${plan.bakeryName}`.toUpperCase(), { font: PDF_FONT_BOLD, size: 12, color: CRUST, spacing: 1 });
      para(d.name, { font: PDF_FONT_BOLD, size: 30 });
      para(`Mix ${m.index} of ${d.mixes.length} · ${u.mass(m.doughGrams)}`, { font: PDF_FONT_BOLD, size: 20 });
      if (m.scheduled) para(`${m.scheduled.dayBefore ? "The day before, " : ""}${time(m.scheduled.startsAt)}–${time(m.scheduled.endsAt)} on ${m.scheduled.mixerName}`, { size: 12, color: MUTED });
      const attention = m.liquid ? liquidNeedsAttention(m.liquid) : !!m.liquidTempAdvice;
      para(`Liquid at ${m.liquidTempC === null ? "—" : u.temp(m.liquidTempC)}`, { font: PDF_FONT_BOLD, size: 18, color: attention ? ALERT : INK });
      const advice = m.liquid ? mixLiquidAdvice(d, m, u) : m.liquidTempAdvice;
      if (advice) para(advice, { size: 12, color: attention ? ALERT : INK });
      doc.y += 6;
      const w = cols(52, 30, 18);
      if (d.paste) {
        para(`Paste: cook to ${u.temp(d.paste.cookToC)}, stirring; cool before adding`, { font: PDF_FONT_BOLD, size: 16, color: CRUST });
        for (const i of m.ingredients.filter((x) => x.pasteGrams > 0)) row([names.get(i.ingredientId) ?? "?", u.mass(i.pasteGrams), "[  ]"], w, { size: 18 });
        doc.y += 6;
      }
      para("Final mix", { font: PDF_FONT_BOLD, size: 16, color: CRUST });
      const ice = m.liquid && m.liquid.iceGrams > 0 ? m.liquid : null;
      for (const i of m.ingredients.filter((x) => x.finalMixGrams > 0)) {
        const name = names.get(i.ingredientId) ?? "?";
        if (ice && ice.waterIngredientId === i.ingredientId) {
          row([`${name} (tap)`, u.mass(Math.max(0, i.finalMixGrams - ice.iceGrams)), "[  ]"], w, { size: 18 });
          row([`Crushed ice, for the ${name.toLowerCase()}`, u.mass(ice.iceGrams), "[  ]"], w, { size: 18 });
        } else row([name, u.mass(i.finalMixGrams), "[  ]"], w, { size: 18 });
      }
      if (d.paste) row(["+ the cooled paste", "", "[  ]"], w, { size: 18 });
      doc.y += 10;
      if (d.targetInternalC) para(`Internal temperature (done at ${u.temp(d.targetInternalC)} or above), one piece per oven load: ________ at ______ by ______`, { font: PDF_FONT_BOLD, size: 11, gap: 6 });
      para(`${d.paste ? `${pasteCautionText(d.paste.cookToC, u)} ` : ""}Keep the mixer guard on and hands out of a running bowl. Keep allergen-free work apart. ${CAUTION_FOOTNOTE}`, { size: 10, color: MUTED });
    }
  }
  doc.end();
  return done;
}
