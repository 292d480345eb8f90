/**
 * The field names the API accepts, read off the shared zod schemas themselves (shared/schemas/*),
 * so the fuzz sends the API's own field names with wrong values and keeps up with new fields.
 */
import fs from "node:fs";
import path from "node:path";
import { z } from "zod";

type AnyDef = { typeName?: string; schema?: z.ZodTypeAny; innerType?: z.ZodTypeAny; type?: z.ZodTypeAny; options?: z.ZodTypeAny[]; left?: z.ZodTypeAny; right?: z.ZodTypeAny; in?: z.ZodTypeAny; out?: z.ZodTypeAny };

function walk(schema: z.ZodTypeAny, out: Map<string, string[]>, seen: Set<unknown>) {
  if (!schema || seen.has(schema)) return;
  seen.add(schema);
  const def = (schema as unknown as { _def: AnyDef })._def;
  if (schema instanceof z.ZodObject) {
    for (const [key, child] of Object.entries(schema.shape as Record<string, z.ZodTypeAny>)) {
      const kinds = out.get(key) || [];
      const kind = String((child as unknown as { _def: AnyDef })._def?.typeName || "unknown");
      if (!kinds.includes(kind)) kinds.push(kind);
      out.set(key, kinds);
      walk(child, out, seen);
    }
    return;
  }
  for (const next of [def?.schema, def?.innerType, def?.type, def?.left, def?.right, def?.in, def?.out, ...(def?.options || [])]) {
    if (next && typeof next === "object" && "_def" in next) walk(next, out, seen);
  }
}

export function fieldNamesOfSchemas(): Map<string, string[]> {
  const dir = path.join(__dirname, "..", "..", "shared", "schemas");
  const out = new Map<string, string[]>();
  const seen = new Set<unknown>();
  for (const file of fs.readdirSync(dir).filter((f) => f.endsWith(".ts"))) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const mod = require(path.join(dir, file)) as Record<string, unknown>;
    for (const value of Object.values(mod)) if (value instanceof z.ZodType) walk(value as z.ZodTypeAny, out, seen);
  }
  if (out.size < 20) throw new Error(`only ${out.size} field names found in shared/schemas: the walker no longer understands the schemas`);
  return out;
}
