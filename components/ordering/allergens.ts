import { ALLERGEN_LABEL, type AllergenCode } from "../../shared/allergens";

const isCode = (s: string): s is AllergenCode => Object.prototype.hasOwnProperty.call(ALLERGEN_LABEL, s);

/** "may contain" is stored as allergen codes ("egg,sesame"); anything else is kept as written. */
export function mayContainParts(text: string): { codes: AllergenCode[]; other: string[] } {
  const codes: AllergenCode[] = [];
  const other: string[] = [];
  for (const raw of text.split(",")) {
    const t = raw.trim();
    if (!t) continue;
    if (isCode(t)) codes.push(t);
    else other.push(t);
  }
  return { codes, other };
}

/** "Egg, Sesame" for "egg,sesame"; "" for nothing. */
export function mayContainLabel(text: string): string {
  const { codes, other } = mayContainParts(text);
  return [...codes.map((c) => ALLERGEN_LABEL[c]), ...other].join(", ");
}

/** Back to the stored form: codes in the fixed list's order, then the rest. */
export function mayContainText(codes: AllergenCode[], other: string[] = []): string {
  return [...codes, ...other.map((o) => o.trim()).filter(Boolean)].join(",");
}
