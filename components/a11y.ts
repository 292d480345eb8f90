/**
 * Colour contrast helpers after WCAG 2.1, success criterion 1.4.3 (Contrast, Minimum) and its
 * definitions of "relative luminance" and "contrast ratio".
 */

/** Parse "#rgb" or "#rrggbb" into 0-255 channels. */
export function parseHex(hex: string): [number, number, number] {
  const raw = hex.trim().replace(/^#/, "");
  const full = raw.length === 3 ? raw.split("").map((c) => c + c).join("") : raw;
  if (!/^[0-9a-fA-F]{6}$/.test(full)) throw new Error(`Not a hex colour: ${hex}`);
  return [0, 2, 4].map((i) => parseInt(full.slice(i, i + 2), 16)) as [number, number, number];
}

/** Relative luminance: 0 for darkest black, 1 for lightest white. */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHex(hex).map((v) => {
    const c = v / 255;
    return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** (L1 + 0.05) / (L2 + 0.05), L1 being the lighter colour. Ranges from 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  const [hi, lo] = la >= lb ? [la, lb] : [lb, la];
  return (hi + 0.05) / (lo + 0.05);
}

/** Normal-size text needs at least 4.5:1 (level AA). */
export const AA_NORMAL_TEXT = 4.5;

export function passesAA(fg: string, bg: string): boolean {
  return contrastRatio(fg, bg) >= AA_NORMAL_TEXT;
}
