import { In, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest, conflict, notFound, parse } from "../http/errors";
import { Product } from "./product.entity";
import { PriceList, PriceListItem } from "./price-list.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { Formula } from "../production/production.entity";
import { productInputSchema, priceListInputSchema, type PriceListDto, type ProductDto } from "../../shared/schemas/catalog";
import { sortAllergens, type AllergenCode } from "../../shared/allergens";
import { derivedAllergens } from "../production/formulas.service";
import { applyPercentOff } from "../../shared/money";
import type { SessionUser } from "../../shared/schemas/auth";
import { checkUpload, type CheckRules } from "../http/upload";
import { photoStore } from "../files/file-store";

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

/**
 * A product with a formula takes its allergens from the formula's ingredients; its own list is used
 * only while it has no formula. The "may contain" note is always the product's own.
 */
export function productDto(p: Product, pricing?: Pricing, derived?: Map<number, AllergenCode[]>): ProductDto {
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    photoUrl: photoUrl(p),
    saleUnit: p.saleUnit,
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
    allergens: derived?.get(p.id) ?? sortAllergens(p.allergens.split(",").filter(Boolean)),
    mayContain: p.mayContain,
    active: p.active,
    formulaId: p.formulaId,
  };
}

export async function listProducts(ctx: AppContext, actor: SessionUser, includeArchived: boolean): Promise<ProductDto[]> {
  const repo = ctx.dataSource.getRepository(Product);
  const showAll = includeArchived && actor.role !== "buyer";
  const rows = await repo.find({ where: showAll ? {} : { active: true }, order: { sortOrder: "ASC", name: "ASC" } });
  const pricing = await pricingFor(ctx, actor.role === "buyer" ? actor.accountId : null);
  const derived = await derivedAllergens(ctx.dataSource.manager, rows);
  return rows.map((p) => productDto(p, pricing, derived));
}

export async function getProduct(ctx: AppContext, actor: SessionUser, id: number): Promise<ProductDto> {
  const p = await ctx.dataSource.getRepository(Product).findOneBy({ id });
  if (!p || (actor.role === "buyer" && !p.active)) throw notFound("That product");
  return productDto(p, await pricingFor(ctx, actor.role === "buyer" ? actor.accountId : null), await derivedAllergens(ctx.dataSource.manager, [p]));
}

function toColumns(input: ReturnType<typeof productInputSchema.parse>) {
  const { allergens, ...rest } = input;
  return { ...rest, allergens: sortAllergens(allergens).join(","), formulaId: input.formulaId ?? null };
}

export async function createProduct(ctx: AppContext, body: unknown): Promise<ProductDto> {
  const input = parse(productInputSchema, body);
  const repo = ctx.dataSource.getRepository(Product);
  if (input.formulaId && !(await ctx.dataSource.getRepository(Formula).existsBy({ id: input.formulaId }))) throw badRequest("Choose an existing formula.", { formulaId: "Choose an existing formula." });
  const saved = await repo.save(repo.create({ ...toColumns(input), photoFile: null, sortOrder: await repo.count() }));
  return productDto(saved, undefined, await derivedAllergens(ctx.dataSource.manager, [saved]));
}

/** A patch is merged with the product and validated as a whole, so min ≤ max holds across fields. */
export async function updateProduct(ctx: AppContext, id: number, body: unknown): Promise<ProductDto> {
  const repo = ctx.dataSource.getRepository(Product);
  const p = await repo.findOneBy({ id });
  if (!p) throw notFound("That product");
  if (!body || typeof body !== "object" || Array.isArray(body)) throw badRequest("Send the fields to change as an object.");
  const current = productDto(p);
  const merged = { ...current, priceCents: current.listPriceCents, ...(body as object) };
  const input = parse(productInputSchema, merged);
  if (input.formulaId && !(await ctx.dataSource.getRepository(Formula).existsBy({ id: input.formulaId }))) throw badRequest("Choose an existing formula.", { formulaId: "Choose an existing formula." });
  await repo.update({ id }, toColumns(input));
  const updated = (await repo.findOneBy({ id }))!;
  return productDto(updated, undefined, await derivedAllergens(ctx.dataSource.manager, [updated]));
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
 * The photo is checked by its bytes and re-encoded (server/http/upload.ts), then stored under its content hash.
 * Two products may share one stored photo, so the old file goes only when no product uses it any more.
 */
export async function setProductPhoto(ctx: AppContext, id: number, buffer: Buffer): Promise<ProductDto> {
  const repo = ctx.dataSource.getRepository(Product);
  const p = await repo.findOneBy({ id });
  if (!p) throw notFound("That product");
  const checked = await checkUpload(buffer, PHOTO_UPLOAD);
  const store = photoStore(ctx.config);
  const file = await store.save(checked.bytes, checked.ext);
  const old = p.photoFile;
  await repo.update({ id }, { photoFile: file });
  if (old && old !== file && !(await repo.existsBy({ photoFile: old }))) await store.remove(old);
  return productDto((await repo.findOneBy({ id }))!);
}

// ---- price lists -------------------------------------------------------------------------

async function priceListDto(ctx: AppContext, list: PriceList): Promise<PriceListDto> {
  const items = await ctx.dataSource.getRepository(PriceListItem).find({ where: { priceListId: list.id }, order: { productId: "ASC" } });
  const accountCount = await ctx.dataSource.getRepository(CustomerAccount).countBy({ priceListId: list.id });
  return { id: list.id, name: list.name, kind: list.kind, percentOff: Number(list.percentOff), items: items.map((i) => ({ productId: i.productId, priceCents: i.priceCents })), accountCount };
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
