import PDFDocument from "pdfkit";
import { DateTime } from "luxon";
import type { PlanDto } from "../../shared/schemas/production";
import { formatMass, formatTemperature, type UnitSystem } from "../../shared/units";
import { PRODUCTION_CAUTIONS } from "../../shared/cautions";

const INK = "#2A211B";
const MUTED = "#5E5247";
const CRUST = "#8A3F12";
const RULE = "#D9CBB8";

/**
 * The production sheet (overview, doughs, timeline, cautions) followed by one weigh-out card per mix,
 * in large type for a bakery wall. Letter size; pdfkit's built-in Helvetica.
 */
export function renderPlanPdf(plan: PlanDto & { bakeryName: string; timeZone: string }, units: UnitSystem): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER", margin: 40, info: { Title: `Production sheet ${plan.date}`, Author: plan.bakeryName, Creator: "Panwise" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  const g = (grams: number) => formatMass(grams, units);
  const t = (c: number) => formatTemperature(c, units);
  const time = (iso: string) => DateTime.fromISO(iso, { setZone: true }).setZone(plan.timeZone).toFormat("ccc HH:mm");
  const day = DateTime.fromISO(plan.date).toFormat("cccc d LLLL yyyy");
  const width = doc.page.width - 80;

  const heading = (text: string, size = 16) => {
    doc.moveDown(0.6).fillColor(CRUST).font("Helvetica-Bold").fontSize(size).text(text).fillColor(INK);
  };
  const rule = () => doc.moveTo(40, doc.y + 2).lineTo(40 + width, doc.y + 2).strokeColor(RULE).lineWidth(1).stroke().moveDown(0.3);
  const row = (cols: string[], widths: number[], opts: { bold?: boolean; size?: number; left?: number[] } = {}) => {
    const y = doc.y;
    let x = 40;
    doc.font(opts.bold ? "Helvetica-Bold" : "Helvetica").fontSize(opts.size ?? 10);
    let h = 0;
    cols.forEach((c, i) => {
      const align = i === 0 || opts.left?.includes(i) ? "left" : "right";
      doc.text(c, x, y, { width: widths[i] - 6, align });
      h = Math.max(h, doc.heightOfString(c, { width: widths[i] - 6 }));
      x += widths[i];
    });
    doc.x = 40;
    doc.y = y + h + 3;
  };
  const ensure = (space: number) => {
    if (doc.y + space > doc.page.height - 50) doc.addPage();
  };

  // ---- sheet -------------------------------------------------------------------------------
  doc.font("Helvetica-Bold").fontSize(11).fillColor(CRUST).text(plan.bakeryName.toUpperCase(), { characterSpacing: 1 });
  doc.font("Helvetica-Bold").fontSize(24).fillColor(INK).text(`Bake day: ${day}`);
  doc.font("Helvetica").fontSize(11).fillColor(MUTED)
    .text(`Leaves at ${time(plan.inputs.dispatchAt)} · ${plan.frozen ? `frozen ${plan.frozenAt ? DateTime.fromISO(plan.frozenAt).setZone(plan.timeZone).toFormat("ccc d LLL HH:mm") : ""}` : "not frozen yet"} · ${plan.final ? "final" : "NOT FINAL: orders may still change until the cut-off"}`)
    .text(`Room ${t(plan.inputs.roomC)} · flour ${t(plan.inputs.flourC)} · paste ${t(plan.inputs.pasteC)} · mixer ${plan.inputs.mixerCapacityKg} kg · packing ${plan.inputs.packingMinutes} min from ${time(plan.inputs.packFrom)}`)
    .fillColor(INK);

  heading("Pans", 18);
  for (const p of plan.products) {
    ensure(40);
    const y = doc.y;
    doc.font("Helvetica-Bold").fontSize(28).text(String(p.pans), 40, y, { width: 70 });
    doc.font("Helvetica-Bold").fontSize(13).text(p.name, 115, y + 4, { width: width - 75 });
    doc.font("Helvetica").fontSize(10).fillColor(MUTED)
      .text(`${p.panName} · ${p.units} ordered${p.extraPans ? ` + ${p.extraPans} extra pan${p.extraPans > 1 ? "s" : ""}` : ""} · ${p.pieces} pieces of ${g(p.pieceGrams)}`, 115, doc.y, { width: width - 75 })
      .fillColor(INK);
    doc.x = 40;
    doc.y = Math.max(doc.y, y + 34) + 4;
  }
  if (plan.warnings.length) {
    heading("Check", 13);
    doc.font("Helvetica").fontSize(10);
    for (const w of plan.warnings) doc.text(`• ${w}`, { width });
  }

  for (const d of plan.doughs) {
    ensure(160);
    heading(`${d.name} — ${g(d.doughGrams)} of dough (formula v${d.formulaVersion})`, 15);
    doc.font("Helvetica").fontSize(10).fillColor(MUTED).text(`Flour ${g(d.flourGrams)}${d.paste ? ` · paste: ${g(d.paste.flourGrams)} flour + ${g(d.paste.liquidGrams)} liquid, cooked to ${t(d.paste.cookToC)}` : ""} · ${d.mixes.length} mix${d.mixes.length > 1 ? "es" : ""}${d.targetInternalC ? ` · done at about ${t(d.targetInternalC)} inside` : ""}`).fillColor(INK);
    const widths = [190, 60, 90, 90, 102];
    row(["Ingredient", "%", "Total", "Paste", "Final mix"], widths, { bold: true });
    rule();
    for (const i of d.ingredients) row([i.name, String(i.percent), g(i.grams), i.pasteGrams ? g(i.pasteGrams) : "—", g(i.finalMixGrams)], widths);
  }

  ensure(120);
  heading("Timeline", 15);
  const tw = [64, 64, 104, 300];
  if (plan.schedule?.earlierStart) doc.font("Helvetica-Bold").fontSize(11).fillColor("#A3261B").text(plan.schedule.earlierStart.text, { width }).fillColor(INK);
  row(["Starts", "Ends", "Where", "Step"], tw, { bold: true, left: [1, 2, 3] });
  rule();
  for (const e of plan.timeline) {
    ensure(16);
    const names = plan.products.filter((p) => e.productIds.includes(p.productId)).map((p) => p.name).join(", ");
    const where = e.resource?.name ?? "—";
    const of = [e.mix ? `mix ${e.mix}` : "", e.load ? `oven load ${e.load}` : ""].filter(Boolean).join(", ");
    row([time(e.startsAt), time(e.endsAt), where, `${e.label}${e.temperatureC ? ` at ${t(e.temperatureC)}` : ""}${of ? ` (${of})` : ""} — ${e.pans === 1 ? "1 pan" : `${e.pans} pans`}: ${names}`], tw, { left: [1, 2, 3] });
  }

  ensure(140);
  heading("Cautions", 13);
  doc.font("Helvetica").fontSize(9.5);
  for (const c of PRODUCTION_CAUTIONS) doc.text(`• ${c.title}: ${c.text}`, { width }).moveDown(0.2);

  // ---- one card per mix ------------------------------------------------------------------------
  for (const d of plan.doughs) {
    const names = new Map(d.ingredients.map((i) => [i.ingredientId, i.name]));
    for (const m of d.mixes) {
      doc.addPage();
      doc.font("Helvetica-Bold").fontSize(12).fillColor(CRUST).text(`${day} · ${plan.bakeryName}`.toUpperCase(), { characterSpacing: 1 });
      doc.font("Helvetica-Bold").fontSize(30).fillColor(INK).text(`${d.name}`);
      doc.font("Helvetica-Bold").fontSize(20).text(`Mix ${m.index} of ${d.mixes.length} · ${g(m.doughGrams)}`);
      doc.font("Helvetica-Bold").fontSize(18).fillColor(m.liquidTempAdvice ? "#A3261B" : INK).text(`Liquid at ${m.liquidTempC === null ? "—" : t(m.liquidTempC)}`);
      if (m.liquidTempAdvice) doc.font("Helvetica").fontSize(12).text(m.liquidTempAdvice, { width });
      doc.fillColor(INK).moveDown(0.5);
      const w = [250, 130, 152];
      if (d.paste) {
        doc.font("Helvetica-Bold").fontSize(16).fillColor(CRUST).text(`Paste — cook to ${t(d.paste.cookToC)}, stirring; cool before adding`).fillColor(INK);
        for (const i of m.ingredients.filter((x) => x.pasteGrams > 0)) row([names.get(i.ingredientId) ?? "?", g(i.pasteGrams), "[  ]"], w, { size: 18 });
        doc.moveDown(0.4);
      }
      doc.font("Helvetica-Bold").fontSize(16).fillColor(CRUST).text("Final mix").fillColor(INK);
      for (const i of m.ingredients.filter((x) => x.finalMixGrams > 0)) row([names.get(i.ingredientId) ?? "?", g(i.finalMixGrams), "[  ]"], w, { size: 18 });
      if (d.paste) row(["+ the cooled paste", "", "[  ]"], w, { size: 18 });
      doc.moveDown(1).font("Helvetica").fontSize(10).fillColor(MUTED)
        .text("Hot paste scalds: stir with a long spoon, cool before handling. Keep hands clear of a running mixer; guards on. Keep allergen-free work apart. Defer to your local food-safety code and the bakery's own procedures.", { width })
        .fillColor(INK);
    }
  }
  doc.end();
  return done;
}
