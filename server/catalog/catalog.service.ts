import { In, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest, conflict, notFound, parse } from "../http/errors";
import { Product } from "./product.entity";
import { PriceList } from "./price-list.entity";
import { PriceListItem } from "./price-list-item.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { Formula } from "../production/formula.entity";
import { Ingredient } from "../production/ingredient.entity";
import { productInputSchema, priceListInputSchema, type PriceListDto, type ProductDto } from "../../shared/schemas/catalog";
import { sortAllergens } from "../../shared/allergens";
import { missingDerived, resolveBake, type ComponentLine } from "../../shared/components";
import { componentDto, componentLine, derivedFor, productMakeup, replaceComponents, type ProductMakeup } from "./components.service";
import { applyPercentOff } from "../../shared/money";
import type { SessionUser } from "../../shared/schemas/auth";
import { checkUpload, type CheckRules } from "../http/upload";
import sharp from "sharp";
import { originalPhotoStore, photoStore } from "../files/file-store";
import { suggestPlural } from "../../shared/quantity";

/** How an account's prices are worked out: the list price, or its price list's. */
export interface Pricing {
  price(product: Product): number;
}

export async function pricingFor(ctx: AppContext, accountId: number | null, m: EntityManager = ctx.dataSource.manager): Promise<Pricing> {
  const listPrice: Pricing = { price: (p) => p.priceCents };
  if (!accountId) return listPrice;
  const account = await m.getRepository(CustomerAccount).findOneBy({ id: accountId });
  if (!account?.priceListId) return listPrice;
  const list = await m.getRepository(PriceList).findOneBy({ id: account.priceListId });
  if (!list) return listPrice;
  if (list.kind === "percent") {
    const pct = Number(list.percentOff);
    return { price: (p) => applyPercentOff(p.priceCents, pct) };
  }
  const items = await m.getRepository(PriceListItem).findBy({ priceListId: list.id });
  const byProduct = new Map(items.map((i) => [i.productId, i.priceCents]));
  return { price: (p) => byProduct.get(p.id) ?? p.priceCents };
}

export const photoUrl = (p: Product) => (p.photoFile ? `/api/uploads/${p.photoFile}` : null);
/** The small size for list tiles; the one size there is for photos stored before sizes were made. */
export const photoThumbUrl = (p: Product) => (p.photoThumbFile ? `/api/uploads/${p.photoThumbFile}` : photoUrl(p));

/**
 * A product's declared allergens are the union of its formula's ingredients', its components' ingredients' and its own
 * additions (server/catalog/components.service.ts): its own list never replaces the derived one. The "may contain"
 * note is always the product's own. Buyers get no components (the recipe stays in the bakery), only the sources.
 */
export function productDto(p: Product, makeup: ProductMakeup, lib: Map<number, Ingredient>, opts: { pricing?: Pricing; forBuyer?: boolean } = {}): ProductDto {
  const { pricing, forBuyer } = opts;
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    photoUrl: photoUrl(p),
    photoThumbUrl: photoThumbUrl(p),
    saleUnit: p.saleUnit,
    saleUnitPlural: p.saleUnitPlural || suggestPlural(p.saleUnit),
    piecesPerUnit: p.piecesPerUnit,
    pieceGrams: p.pieceGrams,
    panName: p.panName,
    panLengthMm: p.panLengthMm,
    panWidthMm: p.panWidthMm,
    unitsPerPan: p.unitsPerPan,
    listPriceCents: p.priceCents,
    priceCents: pricing ? pricing.price(p) : p.priceCents,
    minQuantity: p.minQuantity,
    maxQuantity: p.maxQuantity,
    leadDays: p.leadDays,
    allergens: makeup.allergens.declared,
    derivedAllergens: makeup.allergens.derived,
    addedAllergens: makeup.allergens.added,
    allergenSources: makeup.allergens.sources,
    mayContain: p.mayContain,
    active: p.active,
    formulaId: p.formulaId,
    formulaName: makeup.formulaName,
    boughtIn: p.boughtIn,
    bakeTempC: p.bakeTempC,
    bakeMinutes: p.bakeMinutes,
    coolMinutes: p.coolMinutes,
    formulaBake: makeup.formulaBake,
    bake: resolveBake(p, makeup.formulaSteps),
    components: forBuyer ? [] : makeup.components.map((c) => componentDto(c, lib)),
  };
}

async function library(m: EntityManager): Promise<Map<number, Ingredient>> {
  return new Map((await m.getRepository(Ingredient).find()).map((i) => [i.id, i]));
}

/** DTOs for many products at once (one query per table). */
export async function productDtos(ctx: AppContext, rows: Product[], opts: { pricing?: Pricing; forBuyer?: boolean } = {}, m: EntityManager = ctx.dataSource.manager): Promise<ProductDto[]> {
  const lib = await library(m);
  const makeup = await productMakeup(m, rows, lib);
  return rows.map((p) => productDto(p, makeup.get(p.id)!, lib, opts));
}

export async function listProducts(ctx: AppContext, actor: SessionUser, includeArchived: boolean): Promise<ProductDto[]> {
  const repo = ctx.dataSource.getRepository(Product);
  const showAll = includeArchived && actor.role !== "buyer";
  const rows = await repo.find({ where: showAll ? {} : { active: true }, order: { sortOrder: "ASC", name: "ASC" } });
  const pricing = await pricingFor(ctx, actor.role === "buyer" ? actor.accountId : null);
  return productDtos(ctx, rows, { pricing, forBuyer: actor.role === "buyer" });
}

export async function getProduct(ctx: AppContext, actor: SessionUser, id: number): Promise<ProductDto> {
  const p = await ctx.dataSource.getRepository(Product).findOneBy({ id });
  if (!p || (actor.role === "buyer" && !p.active)) throw notFound("That product");
  const pricing = await pricingFor(ctx, actor.role === "buyer" ? actor.accountId : null);
  return (await productDtos(ctx, [p], { pricing, forBuyer: actor.role === "buyer" }))[0];
}

async function productOut(ctx: AppContext, id: number): Promise<ProductDto> {
  return (await productDtos(ctx, [await ctx.dataSource.getRepository(Product).findOneByOrFail({ id })]))[0];
}

type ParsedProduct = ReturnType<typeof productInputSchema.parse>;

/**
 * Check what the database must confirm (the formula and the components' ingredients exist), then work out what the
 * product derives. A declaration sent without a derived allergen is a 400 naming it and its source: a product may add
 * allergens, never take one away. Returns the columns to store (the product's own list holds only its additions).
 */
async function prepare(ctx: AppContext, input: ParsedProduct, sentAllergens: boolean, components: ComponentLine[]) {
  const m = ctx.dataSource.manager;
  if (input.formulaId && !(await m.getRepository(Formula).existsBy({ id: input.formulaId }))) throw badRequest("Choose an existing formula.", { formulaId: "Choose an existing formula." });
  const ingredientIds = [...new Set(components.map((c) => c.ingredientId))];
  if (ingredientIds.length) {
    const found = new Set((await m.getRepository(Ingredient).findBy({ id: In(ingredientIds) })).map((i) => i.id));
    const fields: Record<string, string> = {};
    components.forEach((c, i) => { if (!found.has(c.ingredientId)) fields[`components.${i}.ingredientId`] = "Choose an ingredient from the library."; });
    if (Object.keys(fields).length) throw badRequest("A component uses an ingredient that is not in the library.", fields);
  }
  const derived = await derivedFor(m, input.formulaId ?? null, components);
  if (sentAllergens) {
    const missing = missingDerived(input.allergens, derived);
    if (missing) throw badRequest(missing.message, { allergens: missing.message });
  }
  const { allergens, components: _components, ...rest } = input;
  return {
    ...rest,
    formulaId: input.formulaId ?? null,
    allergens: sortAllergens(allergens).filter((a) => !derived.derived.includes(a)).join(","),
  };
}

const linesOf = (input: ParsedProduct): ComponentLine[] =>
  (input.components ?? []).map((c) => ({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: c.grams, per: c.per, note: c.note }));

const isObject = (body: unknown): body is Record<string, unknown> => !!body && typeof body === "object" && !Array.isArray(body);

export async function createProduct(ctx: AppContext, body: unknown): Promise<ProductDto> {
  const input = parse(productInputSchema, body);
  const lines = linesOf(input);
  const columns = await prepare(ctx, input, isObject(body) && "allergens" in body, lines);
  const id = await ctx.dataSource.transaction(async (m) => {
    const repo = m.getRepository(Product);
    const saved = await repo.save(repo.create({ ...columns, photoFile: null, sortOrder: await repo.count() }));
    await replaceComponents(m, saved.id, lines);
    return saved.id;
  });
  return productOut(ctx, id);
}

/**
 * A patch is merged with the product and validated as a whole, so min ≤ max and "a formula or bought in" hold across
 * fields. Components are replaced only when the patch sends them; the allergens only when it sends them.
 */
export async function updateProduct(ctx: AppContext, id: number, body: unknown): Promise<ProductDto> {
  const repo = ctx.dataSource.getRepository(Product);
  const p = await repo.findOneBy({ id });
  if (!p) throw notFound("That product");
  if (!isObject(body)) throw badRequest("Send the fields to change as an object.");
  const [current] = await productDtos(ctx, [p]);
  const { listPriceCents, components, addedAllergens, ...rest } = current;
  const merged = { ...rest, priceCents: listPriceCents, allergens: addedAllergens, components, ...body };
  const input = parse(productInputSchema, merged);
  const sentComponents = "components" in body;
  const lines = sentComponents ? linesOf(input) : (await productMakeup(ctx.dataSource.manager, [p])).get(id)!.components.map(componentLine);
  const columns = await prepare(ctx, input, "allergens" in body, lines);
  await ctx.dataSource.transaction(async (m) => {
    await m.getRepository(Product).update({ id }, columns);
    if (sentComponents) await replaceComponents(m, id, lines);
  });
  return productOut(ctx, id);
}

// ---- photos -------------------------------------------------------------------------------

export const PHOTO_MAX_BYTES = 5 * 1024 * 1024;
/** Photos are shown at most about 1200 px wide (2× for sharp screens): larger ones are scaled down when stored. */
export const PHOTO_MAX_SIDE = 2400;

export const PHOTO_UPLOAD: CheckRules = {
  field: "photo",
  what: "photo",
  maxBytes: PHOTO_MAX_BYTES,
  accept: ["image/jpeg", "image/png", "image/webp"],
  acceptText: "a JPEG, PNG or WebP photo",
  maxImageSide: PHOTO_MAX_SIDE,
};

/**
 * The sizes a photo is shown at, in CSS pixels at 2× for sharp screens: list tiles are at most 80 px (160), product
 * screens at most 320 px (640). WebP at quality 82 (sharp docs, webp options; Google's WebP study puts quality
 * 75–85 at JPEG-like quality for about a quarter less size — from memory).
 */
export const PHOTO_SIZES = { thumb: 160, large: 640 } as const;

async function photoSize(original: Buffer, side: number): Promise<Buffer> {
  // sharp drops all metadata unless told to keep it (sharp docs, "withMetadata"): no EXIF, no GPS position.
  return sharp(original, { failOn: "error" }).resize({ width: side, height: side, fit: "inside", withoutEnlargement: true }).webp({ quality: 82 }).timeout({ seconds: 20 }).toBuffer();
}

/**
 * The photo is checked by its bytes and re-encoded (server/http/upload.ts); that checked original is kept in the
 * private originals store, and the two sizes screens show are made from it as WebP and stored in the public store,
 * each under its content hash. Two products may share stored files, so an old file goes only when no product uses
 * it any more.
 */
export async function setProductPhoto(ctx: AppContext, id: number, buffer: Buffer): Promise<ProductDto> {
  const repo = ctx.dataSource.getRepository(Product);
  const p = await repo.findOneBy({ id });
  if (!p) throw notFound("That product");
  const checked = await checkUpload(buffer, PHOTO_UPLOAD);
  const [large, thumb] = await Promise.all([photoSize(checked.bytes, PHOTO_SIZES.large), photoSize(checked.bytes, PHOTO_SIZES.thumb)]);
  const store = photoStore(ctx.config);
  const originals = originalPhotoStore(ctx.config);
  const next = { photoFile: await store.save(large, "webp"), photoThumbFile: await store.save(thumb, "webp"), photoOriginalFile: await originals.save(checked.bytes, checked.ext) };
  await repo.update({ id }, next);
  await removeUnusedPhotoFiles(ctx, p);
  return productOut(ctx, id);
}

/** Remove the files a product's earlier photo used, where no product uses them any more. */
async function removeUnusedPhotoFiles(ctx: AppContext, was: Pick<Product, "photoFile" | "photoThumbFile" | "photoOriginalFile">): Promise<void> {
  const repo = ctx.dataSource.getRepository(Product);
  const used = async (file: string) =>
    (await repo.existsBy({ photoFile: file })) || (await repo.existsBy({ photoThumbFile: file })) || (await repo.existsBy({ photoOriginalFile: file }));
  for (const file of [was.photoFile, was.photoThumbFile]) if (file && !(await used(file))) await photoStore(ctx.config).remove(file);
  if (was.photoOriginalFile && !(await used(was.photoOriginalFile))) await originalPhotoStore(ctx.config).remove(was.photoOriginalFile);
}

// ---- price lists -------------------------------------------------------------------------

async function priceListDto(ctx: AppContext, list: PriceList): Promise<PriceListDto> {
  const items = await ctx.dataSource.getRepository(PriceListItem).find({ where: { priceListId: list.id }, order: { productId: "ASC" } });
  const on = await ctx.dataSource.getRepository(CustomerAccount).find({ where: { priceListId: list.id }, order: { businessName: "ASC" } });
  return {
    id: list.id, name: list.name, kind: list.kind, percentOff: Number(list.percentOff), items: items.map((i) => ({ productId: i.productId, priceCents: i.priceCents })),
    accountCount: on.length, accounts: on.map((a) => ({ id: a.id, businessName: a.businessName })),
  };
}

export async function listPriceLists(ctx: AppContext): Promise<PriceListDto[]> {
  const lists = await ctx.dataSource.getRepository(PriceList).find({ order: { name: "ASC" } });
  return Promise.all(lists.map((l) => priceListDto(ctx, l)));
}

export async function savePriceList(ctx: AppContext, id: number | null, body: unknown): Promise<PriceListDto> {
  const input = parse(priceListInputSchema, body);
  const productIds = input.items.map((i) => i.productId);
  if (productIds.length) {
    const found = await ctx.dataSource.getRepository(Product).countBy({ id: In(productIds) });
    if (found !== new Set(productIds).size) throw badRequest("A price is set for a product that does not exist.", { items: "Unknown product." });
  }
  const saved = await ctx.dataSource.transaction(async (m) => {
    const repo = m.getRepository(PriceList);
    const dup = await repo.findOneBy({ name: input.name });
    if (dup && dup.id !== id) throw conflict("name_taken", "Another price list has this name.");
    let list: PriceList;
    if (id) {
      const existing = await repo.findOneBy({ id });
      if (!existing) throw notFound("That price list");
      await repo.update({ id }, { name: input.name, kind: input.kind, percentOff: String(input.percentOff) });
      list = (await repo.findOneBy({ id }))!;
    } else {
      list = await repo.save(repo.create({ name: input.name, kind: input.kind, percentOff: String(input.percentOff) }));
    }
    await m.getRepository(PriceListItem).delete({ priceListId: list.id });
    if (input.kind === "fixed" && input.items.length) {
      await m.getRepository(PriceListItem).insert(input.items.map((i) => ({ priceListId: list.id, productId: i.productId, priceCents: i.priceCents })));
    }
    return list;
  });
  return priceListDto(ctx, saved);
}

export async function deletePriceList(ctx: AppContext, id: number): Promise<void> {
  await ctx.dataSource.transaction(async (m) => {
    if (!(await m.getRepository(PriceList).existsBy({ id }))) throw notFound("That price list");
    await m.getRepository(CustomerAccount).update({ priceListId: id }, { priceListId: null });
    await m.getRepository(PriceListItem).delete({ priceListId: id });
    await m.getRepository(PriceList).delete({ id });
  });
}
