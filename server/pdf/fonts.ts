import fs from "node:fs";
import path from "node:path";

/**
 * The app's own typeface in every PDF: Nunito, the font the screens use (@expo-google-fonts/nunito, SIL Open Font
 * License 1.1), embedded with pdfkit's registerFont. Unlike the built-in Helvetica (WinAnsi only, PDF 32000-1
 * Annex D), it carries the Latin Extended letters of names such as "Łódź" and signs such as "≤", "≈" and "−";
 * pdfkit embeds the glyphs used, with a ToUnicode map, so the text can be searched and copied.
 */
export const PDF_FONT = "Nunito";
export const PDF_FONT_BOLD = "Nunito-Bold";
export type PdfFont = typeof PDF_FONT | typeof PDF_FONT_BOLD;

const NUNITO_DIR = path.dirname(require.resolve("@expo-google-fonts/nunito/package.json"));
export const PDF_FONT_FILES: Record<PdfFont, string> = {
  [PDF_FONT]: path.join(NUNITO_DIR, "400Regular", "Nunito_400Regular.ttf"),
  [PDF_FONT_BOLD]: path.join(NUNITO_DIR, "700Bold", "Nunito_700Bold.ttf"),
};

let loaded: [PdfFont, Buffer][] | null = null;

/** Register both weights on a new document (the files are read once per process) and start in the regular one. */
export function useAppFonts(doc: PDFKit.PDFDocument): void {
  loaded ??= (Object.entries(PDF_FONT_FILES) as [PdfFont, string][]).map(([name, file]) => [name, fs.readFileSync(file)]);
  for (const [name, data] of loaded) doc.registerFont(name, data);
  doc.font(PDF_FONT);
}

/**
 * The few characters Panwise writes that Nunito has no glyph for, written with ones it has: the arrow, and the
 * narrow no-break space that Intl puts before "AM"/"PM" in some locales (CLDR 42 and later).
 */
const SUBSTITUTES: [RegExp, string][] = [[/\u2192/g, "->"], [/\u202F/g, "\u00A0"]];
export const pdfText = (s: string) => SUBSTITUTES.reduce((t, [re, to]) => t.replace(re, to), s);
