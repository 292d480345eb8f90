import { In, type EntityManager } from "typeorm";
import { Product } from "./product.entity";
import { ProductComponent } from "./product-component.entity";
import { Formula } from "../production/formula.entity";
import { FormulaVersion } from "../production/formula-version.entity";
import { Ingredient } from "../production/ingredient.entity";
import { sortAllergens, type AllergenCode } from "../../shared/allergens";
import { declaredAllergens, formulaBake, groupComponents, type ComponentLine, type DeclaredAllergens, type ResolvedBake } from "../../shared/components";
import type { StepSpec } from "../../shared/production";
import type { ComponentDto } from "../../shared/schemas/catalog";

/**
 * What a product is made of besides its piece weight: its formula's current version (for allergens and the bake
 * defaults) and its components. Loaded for many products at once (one query per table, not one per product).
 */
export interface ProductMakeup {
  formulaName: string | null;
  /** The formula's current version's steps (null without a formula). */
  formulaSteps: StepSpec[] | null;
  formulaBake: ResolvedBake | null;
  components: ProductComponent[];
  allergens: DeclaredAllergens;
}

const codes = (s: string | null | undefined) => (s ?? "").split(",").filter(Boolean);

export const componentLine = (c: ProductComponent): ComponentLine => ({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: Number(c.grams), per: c.per, note: c.note });

export async function loadComponents(m: EntityManager, productIds: number[]): Promise<Map<number, ProductComponent[]>> {
  const out = new Map<number, ProductComponent[]>();
  if (!productIds.length) return out;
  const rows = await m.getRepository(ProductComponent).find({ where: { productId: In(productIds) }, order: { productId: "ASC", sortOrder: "ASC", id: "ASC" } });
  for (const r of rows) out.set(r.productId, [...(out.get(r.productId) ?? []), r]);
  return out;
}

/** The current version's lines and steps of each formula. */
async function formulaBodies(m: EntityManager, formulaIds: number[]): Promise<Map<number, { name: string; lines: { ingredientId: number }[]; steps: StepSpec[] }>> {
  const out = new Map<number, { name: string; lines: { ingredientId: number }[]; steps: StepSpec[] }>();
  if (!formulaIds.length) return out;
  const formulas = await m.getRepository(Formula).findBy({ id: In(formulaIds) });
  const versions = formulas.length
    ? await m.getRepository(FormulaVersion).find({ where: formulas.map((f) => ({ formulaId: f.id, version: f.currentVersion })) })
    : [];
  for (const f of formulas) {
    const v = versions.find((x) => x.formulaId === f.id && x.version === f.currentVersion);
    if (!v) continue;
    const body = JSON.parse(v.body) as { lines?: { ingredientId: number }[]; steps?: StepSpec[] };
    out.set(f.id, { name: f.name, lines: body.lines ?? [], steps: body.steps ?? [] });
  }
  return out;
}

/**
 * The allergens a formula and a set of components derive, plus the product's own additions: the declaration is
 * the union (shared/components.ts declaredAllergens), never the product's list in place of the derived one.
 */
function declare(
  formula: { name: string; lines: { ingredientId: number }[] } | null | undefined,
  components: ComponentLine[],
  added: readonly string[],
  lib: Map<number, Ingredient>,
): DeclaredAllergens {
  return declaredAllergens({
    formulaName: formula?.name ?? null,
    formula: formula ? formula.lines.flatMap((l) => codes(lib.get(l.ingredientId)?.allergens)) : [],
    components: groupComponents(components).map((g) => ({ name: g.name, allergens: g.lines.flatMap((l) => codes(lib.get(l.ingredientId)?.allergens)) })),
    added,
  });
}

export async function productMakeup(m: EntityManager, products: Product[], lib?: Map<number, Ingredient>): Promise<Map<number, ProductMakeup>> {
  const out = new Map<number, ProductMakeup>();
  if (!products.length) return out;
  const library = lib ?? new Map((await m.getRepository(Ingredient).find()).map((i) => [i.id, i]));
  const bodies = await formulaBodies(m, [...new Set(products.map((p) => p.formulaId).filter((x): x is number => !!x))]);
  const comps = await loadComponents(m, products.map((p) => p.id));
  for (const p of products) {
    const body = p.formulaId ? bodies.get(p.formulaId) : undefined;
    const components = comps.get(p.id) ?? [];
    out.set(p.id, {
      formulaName: body?.name ?? null,
      formulaSteps: body?.steps ?? null,
      formulaBake: body ? formulaBake(body.steps) : null,
      components,
      allergens: declare(body, components.map(componentLine), codes(p.allergens), library),
    });
  }
  return out;
}

/** The declared allergens of many products (orders, order e-mails, plans use this). */
export async function declaredAllergensOf(m: EntityManager, products: Product[]): Promise<Map<number, AllergenCode[]>> {
  const makeup = await productMakeup(m, products);
  return new Map([...makeup].map(([id, mk]) => [id, mk.allergens.declared]));
}

/** What a product would derive with this formula and these components (before it is saved). */
export async function derivedFor(m: EntityManager, formulaId: number | null, components: ComponentLine[]): Promise<DeclaredAllergens> {
  const lib = new Map((await m.getRepository(Ingredient).find()).map((i) => [i.id, i]));
  const body = formulaId ? (await formulaBodies(m, [formulaId])).get(formulaId) : null;
  return declare(body, components, [], lib);
}

export function componentDto(c: ProductComponent, lib: Map<number, Ingredient>): ComponentDto {
  const ing = lib.get(c.ingredientId);
  return { kind: c.kind, name: c.name, ingredientId: c.ingredientId, ingredientName: ing?.name ?? "?", grams: Number(c.grams), per: c.per, note: c.note, allergens: sortAllergens(codes(ing?.allergens)) };
}

/** Replace a product's components (inside the caller's transaction). */
export async function replaceComponents(m: EntityManager, productId: number, lines: ComponentLine[]): Promise<void> {
  const repo = m.getRepository(ProductComponent);
  await repo.delete({ productId });
  if (!lines.length) return;
  await repo.insert(lines.map((l, i) => ({ productId, sortOrder: i, kind: l.kind, name: l.name.trim(), ingredientId: l.ingredientId, grams: l.grams.toFixed(1), per: l.per, note: l.note })));
}
