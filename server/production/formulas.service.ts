import type { EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest, conflict, notFound, parse } from "../http/errors";
import { Formula } from "./formula.entity";
import { FormulaVersion } from "./formula-version.entity";
import { Ingredient } from "./ingredient.entity";
import { Product } from "../catalog/product.entity";
import { declaredAllergensOf } from "../catalog/components.service";
import { formulaFigures, validateFormula, type FormulaSpec, type IngredientInfo } from "../../shared/production";
import { formulaInputSchema, ingredientInputSchema, type FormulaDto, type IngredientDto } from "../../shared/schemas/production";
import type { FormulaVersionDto } from "../../shared/contracts/production";
import { sortAllergens, type AllergenCode } from "../../shared/allergens";

type Body = Omit<FormulaSpec, "id" | "version"> & { targetInternalC: number | null };

export function ingredientDto(i: Ingredient): IngredientDto {
  return { id: i.id, name: i.name, kind: i.kind, waterPercent: Number(i.waterPercent), allergens: sortAllergens(i.allergens.split(",").filter(Boolean)), packName: i.packName, packGrams: i.packGrams, packCostCents: i.packCostCents };
}

export const ingredientInfo = (i: Ingredient): IngredientInfo => ({ id: i.id, name: i.name, kind: i.kind, waterPercent: Number(i.waterPercent) });

export async function ingredientLibrary(m: EntityManager): Promise<Map<number, Ingredient>> {
  return new Map((await m.getRepository(Ingredient).find()).map((i) => [i.id, i]));
}

export async function listIngredients(ctx: AppContext): Promise<IngredientDto[]> {
  return (await ctx.dataSource.getRepository(Ingredient).find({ order: { kind: "ASC", name: "ASC" } })).map(ingredientDto);
}

export async function saveIngredient(ctx: AppContext, id: number | null, body: unknown): Promise<IngredientDto> {
  const input = parse(ingredientInputSchema, body);
  const repo = ctx.dataSource.getRepository(Ingredient);
  const dup = await repo.findOneBy({ name: input.name });
  if (dup && dup.id !== id) throw conflict("name_taken", "Another ingredient has this name.");
  const values = { ...input, waterPercent: String(input.waterPercent), allergens: sortAllergens(input.allergens).join(",") };
  if (id) {
    if (!(await repo.existsBy({ id }))) throw notFound("That ingredient");
    await repo.update({ id }, values);
    return ingredientDto((await repo.findOneBy({ id }))!);
  }
  return ingredientDto(await repo.save(repo.create(values)));
}

/** A formula version's body, as stored. */
export async function formulaSpec(m: EntityManager, formulaId: number, version?: number): Promise<FormulaSpec & { targetInternalC: number | null }> {
  const f = await m.getRepository(Formula).findOneBy({ id: formulaId });
  if (!f) throw notFound("That formula");
  const v = await m.getRepository(FormulaVersion).findOneBy({ formulaId, version: version ?? f.currentVersion });
  if (!v) throw notFound("That formula version");
  const body = JSON.parse(v.body) as Body;
  return { ...body, id: f.id, version: v.version, name: f.name };
}

/** Allergens a formula carries: the union of its ingredients'. */
export function formulaAllergens(spec: Pick<FormulaSpec, "lines">, lib: Map<number, Ingredient>): AllergenCode[] {
  return sortAllergens(spec.lines.flatMap((l) => (lib.get(l.ingredientId)?.allergens ?? "").split(",").filter(Boolean)));
}

async function dto(ctx: AppContext, m: EntityManager, spec: FormulaSpec & { targetInternalC: number | null }, lib: Map<number, Ingredient>): Promise<FormulaDto> {
  const info = new Map([...lib].map(([id, i]) => [id, ingredientInfo(i)]));
  const productIds = (await m.getRepository(Product).find({ where: { formulaId: spec.id }, select: { id: true } })).map((p) => p.id);
  return {
    id: spec.id,
    name: spec.name,
    version: spec.version,
    lossPercent: spec.lossPercent,
    ddtC: spec.ddtC,
    frictionC: spec.frictionC,
    targetInternalC: spec.targetInternalC,
    paste: spec.paste,
    lines: spec.lines.map((l) => ({ ingredientId: l.ingredientId, name: lib.get(l.ingredientId)?.name ?? "?", kind: lib.get(l.ingredientId)?.kind ?? "other", percent: l.percent })),
    steps: spec.steps,
    figures: formulaFigures(spec, info),
    allergens: formulaAllergens(spec, lib),
    productIds,
  };
}

export async function listFormulas(ctx: AppContext): Promise<FormulaDto[]> {
  const m = ctx.dataSource.manager;
  const lib = await ingredientLibrary(m);
  const formulas = await m.getRepository(Formula).find({ order: { name: "ASC" } });
  return Promise.all(formulas.map(async (f) => dto(ctx, m, await formulaSpec(m, f.id), lib)));
}

export async function getFormula(ctx: AppContext, id: number, version?: number): Promise<FormulaDto> {
  const m = ctx.dataSource.manager;
  return dto(ctx, m, await formulaSpec(m, id, version), await ingredientLibrary(m));
}

export async function formulaHistory(ctx: AppContext, id: number): Promise<FormulaVersionDto[]> {
  if (!(await ctx.dataSource.getRepository(Formula).existsBy({ id }))) throw notFound("That formula");
  const rows = await ctx.dataSource.getRepository(FormulaVersion).find({ where: { formulaId: id }, order: { version: "DESC" } });
  return rows.map((r) => ({ version: r.version, note: r.note, editedById: r.editedById, createdAt: r.createdAt.toISOString() }));
}

/** Create a formula, or save an edit as its next version (earlier versions stay for the plans that used them). */
export async function saveFormula(ctx: AppContext, actorId: number, id: number | null, body: unknown): Promise<FormulaDto> {
  const input = parse(formulaInputSchema, body);
  const m = ctx.dataSource.manager;
  const lib = await ingredientLibrary(m);
  const errors = validateFormula(input, new Map([...lib].map(([k, i]) => [k, ingredientInfo(i)])));
  if (Object.keys(errors).length) throw badRequest(Object.keys(errors).length === 1 ? Object.values(errors)[0] : "The formula needs attention.", errors);
  const { note, name, ...rest } = input;
  const stored: Body = { ...rest, name, lossPercent: Number(rest.lossPercent), ddtC: Number(rest.ddtC), frictionC: Number(rest.frictionC), targetInternalC: rest.targetInternalC === null ? null : Number(rest.targetInternalC),
    paste: rest.paste ? { ...rest.paste, flourPercent: Number(rest.paste.flourPercent), liquidRatio: Number(rest.paste.liquidRatio), cookToC: Number(rest.paste.cookToC) } : null };
  const formulaId = await ctx.dataSource.transaction(async (tx) => {
    const repo = tx.getRepository(Formula);
    const dup = await repo.findOneBy({ name });
    if (dup && dup.id !== id) throw conflict("name_taken", "Another formula has this name.");
    let f: Formula;
    if (id) {
      const found = await repo.createQueryBuilder("f").setLock("pessimistic_write").where("f.id = :id", { id }).getOne();
      if (!found) throw notFound("That formula");
      f = found;
      f.currentVersion += 1;
      await repo.update({ id }, { name, currentVersion: f.currentVersion });
    } else {
      f = await repo.save(repo.create({ name, currentVersion: 1 }));
    }
    await tx.getRepository(FormulaVersion).insert({ formulaId: f.id, version: f.currentVersion, body: JSON.stringify(stored), editedById: actorId, note });
    return f.id;
  });
  return getFormula(ctx, formulaId);
}

/**
 * Declared allergens of many products at once: the union of their formulas' ingredients, their components'
 * ingredients and their own additions (server/catalog/components.service.ts). Never the product's own list alone.
 */
export async function derivedAllergens(m: EntityManager, products: Product[]): Promise<Map<number, AllergenCode[]>> {
  return declaredAllergensOf(m, products);
}
