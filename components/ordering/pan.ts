/** 1 inch is exactly 25.4 mm (the international yard and pound agreement of 1959; NIST SP 811, B.8). */
export const MM_PER_INCH = 25.4;

/** Millimetres as inches, to the nearest tenth: 330 → "13 in", 229 → "9 in", 250 → "9.8 in". */
export function mmToInches(mm: number): string {
  if (!Number.isFinite(mm) || mm <= 0) return "";
  const inches = Math.round((mm / MM_PER_INCH) * 10) / 10;
  return `${Number.isInteger(inches) ? inches.toFixed(0) : inches.toFixed(1)} in`;
}
