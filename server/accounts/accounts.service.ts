import type { AppContext } from "../http/context";
import { notFound } from "../http/errors";
import { CustomerAccount } from "./account.entity";
import { User } from "../users/user.entity";
import type { AccountBuyerDto, AccountDto, AccountStatus } from "../../shared/schemas/accounts";
import type { SessionUser } from "../../shared/schemas/auth";
import type { OfficeSummaryDto } from "../../shared/schemas/bakery";

async function buyerCounts(ctx: AppContext, ids: number[]): Promise<Map<number, number>> {
  if (ids.length === 0) return new Map();
  const rows: { accountId: number; n: string }[] = await ctx.dataSource.getRepository(User).createQueryBuilder("u")
    .select("u.accountId", "accountId").addSelect("COUNT(*)", "n")
    .where("u.accountId IN (:...ids) AND u.disabled = 0", { ids }).groupBy("u.accountId").getRawMany();
  return new Map(rows.map((r) => [Number(r.accountId), Number(r.n)]));
}

function dto(a: CustomerAccount, buyers: number): AccountDto {
  return {
    id: a.id,
    businessName: a.businessName,
    deliveryAddress: a.deliveryAddress,
    contactName: a.contactName,
    contactPhone: a.contactPhone,
    billingEmail: a.billingEmail,
    status: a.status,
    notes: a.notes,
    paymentTerms: a.paymentTerms,
    creditHold: a.creditHold,
    buyerCount: buyers,
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  };
}

export async function listAccounts(ctx: AppContext, opts: { q?: string; status?: AccountStatus }): Promise<AccountDto[]> {
  const qb = ctx.dataSource.getRepository(CustomerAccount).createQueryBuilder("a").orderBy("a.businessName", "ASC");
  if (opts.q) {
    qb.andWhere("(a.businessName LIKE :q OR a.contactName LIKE :q OR a.billingEmail LIKE :q OR a.deliveryAddress LIKE :q)", { q: `%${opts.q.replace(/[%_\\]/g, "\\$&")}%` });
  }
  if (opts.status) qb.andWhere("a.status = :status", { status: opts.status });
  const rows = await qb.getMany();
  const counts = await buyerCounts(ctx, rows.map((r) => r.id));
  return rows.map((r) => dto(r, counts.get(r.id) ?? 0));
}

/** A buyer may only see their own account; anything else is "not found", never "forbidden". */
export async function getAccount(ctx: AppContext, actor: SessionUser, id: number): Promise<AccountDto> {
  if (actor.role === "buyer" && actor.accountId !== id) throw notFound("That account");
  const a = await ctx.dataSource.getRepository(CustomerAccount).findOneBy({ id });
  if (!a) throw notFound("That account");
  return dto(a, (await buyerCounts(ctx, [a.id])).get(a.id) ?? 0);
}

export async function createAccount(ctx: AppContext, input: Omit<AccountDto, "id" | "buyerCount" | "createdAt" | "updatedAt" | "paymentTerms" | "creditHold">): Promise<AccountDto> {
  const repo = ctx.dataSource.getRepository(CustomerAccount);
  const saved = await repo.save(repo.create(input));
  return dto(saved, 0);
}

export async function updateAccount(ctx: AppContext, actor: SessionUser, id: number, patch: Partial<AccountDto>): Promise<AccountDto> {
  const repo = ctx.dataSource.getRepository(CustomerAccount);
  const existing = await repo.findOneBy({ id });
  if (!existing) throw notFound("That account");
  await repo.update({ id }, patch);
  return getAccount(ctx, actor, id);
}

export async function accountCounts(ctx: AppContext): Promise<OfficeSummaryDto["accounts"]> {
  const rows: { status: AccountStatus; n: string; credit: string }[] = await ctx.dataSource.getRepository(CustomerAccount).createQueryBuilder("a")
    .select("a.status", "status").addSelect("COUNT(*)", "n").addSelect("SUM(a.status = 'on_hold' AND a.creditHold = 1)", "credit").groupBy("a.status").getRawMany();
  const by = Object.fromEntries(rows.map((r) => [r.status, Number(r.n)])) as Record<string, number>;
  const active = by.active ?? 0, onHold = by.on_hold ?? 0, closed = by.closed ?? 0;
  const creditHold = rows.reduce((s, r) => s + Number(r.credit ?? 0), 0);
  return { total: active + onHold + closed, active, onHold, paused: onHold - creditHold, creditHold, closed };
}

/** The account's buyers by name (active first, then turned off), for the office's account page. */
export async function accountBuyers(ctx: AppContext, id: number): Promise<AccountBuyerDto[]> {
  if (!(await ctx.dataSource.getRepository(CustomerAccount).existsBy({ id }))) throw notFound("That account");
  const users = await ctx.dataSource.getRepository(User).find({ where: { accountId: id, role: "buyer" }, order: { disabled: "ASC", name: "ASC" } });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email, disabled: u.disabled, lastSignInAt: u.lastSignInAt?.toISOString() ?? null }));
}
