import { IsNull, MoreThan, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, conflict, notFound } from "../http/errors";
import { User } from "./user.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { AuthToken } from "../auth/auth-token.entity";
import { INVITATION_TTL_MS, newLinkToken } from "../auth/tokens";
import { getBakery } from "../bakery/bakery.service";
import { invitationMail } from "../mail/templates";
import { enqueueMail } from "../mail/outbox.service";
import { ROLE_LABELS, type Role } from "../../shared/roles";
import type { InvitationDto, UserDto } from "../../shared/schemas/users";
import type { SessionUser } from "../../shared/schemas/auth";
import type { OfficeSummaryDto } from "../../shared/schemas/bakery";

function userDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    accountId: u.accountId,
    accountName: u.account?.businessName ?? null,
    disabled: u.disabled,
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
    createdAt: u.createdAt.toISOString(),
  };
}

export async function listUsers(ctx: AppContext, q?: string): Promise<UserDto[]> {
  const qb = ctx.dataSource.getRepository(User).createQueryBuilder("u").leftJoinAndSelect("u.account", "a").orderBy("u.role", "ASC").addOrderBy("u.name", "ASC");
  if (q) qb.where("(u.name LIKE :q OR u.email LIKE :q OR a.businessName LIKE :q)", { q: `%${q.replace(/[%_\\]/g, "\\$&")}%` });
  return (await qb.getMany()).map(userDto);
}

export async function getUser(ctx: AppContext, id: number): Promise<UserDto> {
  const u = await ctx.dataSource.getRepository(User).findOne({ where: { id }, relations: { account: true } });
  if (!u) throw notFound("That person");
  return userDto(u);
}

async function accountForBuyer(ctx: AppContext, accountId: number | null | undefined, m: EntityManager = ctx.dataSource.manager): Promise<CustomerAccount> {
  const account = accountId ? await m.getRepository(CustomerAccount).findOneBy({ id: accountId }) : null;
  if (!account) throw badRequest("Choose an existing customer account.", { accountId: "Choose an existing customer account." });
  if (account.status === "closed") throw badRequest("That account is closed.", { accountId: "That account is closed; reopen it first." });
  return account;
}

export async function updateUser(
  ctx: AppContext,
  actor: SessionUser,
  id: number,
  patch: { role?: Role; accountId?: number | null; disabled?: boolean; name?: string },
): Promise<UserDto> {
  await ctx.dataSource.transaction(async (m) => {
    const repo = m.getRepository(User);
    // Lock the owners so two owners demoting each other at once cannot both succeed.
    const owners = await repo.createQueryBuilder("u").setLock("pessimistic_write").where("u.role = 'owner' AND u.disabled = 0").getMany();
    const user = await repo.createQueryBuilder("u").setLock("pessimistic_write").where("u.id = :id", { id }).getOne();
    if (!user) throw notFound("That person");
    const nextRole = patch.role ?? user.role;
    const nextDisabled = patch.disabled ?? user.disabled;
    const isActiveOwner = user.role === "owner" && !user.disabled;
    if (isActiveOwner && (nextRole !== "owner" || nextDisabled) && owners.length <= 1) {
      throw conflict("last_owner", "This is the only active owner. Make someone else an owner first.");
    }
    let accountId = user.accountId;
    if (nextRole === "buyer") {
      const wanted = patch.accountId !== undefined ? patch.accountId : user.accountId;
      accountId = (await accountForBuyer(ctx, wanted, m)).id;
    } else {
      if (patch.accountId) throw badRequest("Only buyers belong to a customer account.", { accountId: "Only buyers belong to a customer account." });
      accountId = null;
    }
    if (actor.id === user.id && nextDisabled) throw conflict("cannot_disable_self", "You cannot turn off your own sign-in.");
    // A new role, another account or a turned-off sign-in ends the person's sessions at once (tokenVersion + 1), so
    // turning them back on later does not revive an old token.
    const endSessions = nextRole !== user.role || accountId !== user.accountId || nextDisabled !== user.disabled;
    await repo.update({ id }, {
      role: nextRole,
      disabled: nextDisabled,
      accountId,
      ...(patch.name ? { name: patch.name } : {}),
      ...(endSessions ? { tokenVersion: () => "tokenVersion + 1" } : {}),
    });
  });
  ctx.logger.info({ event: "user_updated", actorId: actor.id, userId: id, changes: Object.keys(patch) }, "user updated");
  return getUser(ctx, id);
}

function invitationDto(t: AuthToken, accounts: Map<number, string>, now: Date): InvitationDto {
  return {
    id: t.id,
    email: t.email,
    role: t.role ?? "buyer",
    accountId: t.accountId,
    accountName: t.accountId ? accounts.get(t.accountId) ?? null : null,
    expiresAt: t.expiresAt.toISOString(),
    expired: t.expiresAt.getTime() <= now.getTime(),
    createdAt: t.createdAt.toISOString(),
  };
}

/** How long an invitation that ran out unused stays listed (to be sent again). */
const EXPIRED_LISTED_MS = 30 * 24 * 60 * 60 * 1000;

/** Invitations not used and not revoked: those still waiting, and those that ran out in the last 30 days (to send again). */
export async function listInvitations(ctx: AppContext): Promise<InvitationDto[]> {
  const now = ctx.clock.now();
  const rows = await ctx.dataSource.getRepository(AuthToken).find({
    where: { kind: "invitation", usedAt: IsNull(), revokedAt: IsNull(), expiresAt: MoreThan(new Date(now.getTime() - EXPIRED_LISTED_MS)) },
    order: { createdAt: "DESC" },
  });
  const accounts = new Map((await ctx.dataSource.getRepository(CustomerAccount).find()).map((a) => [a.id, a.businessName]));
  return rows.map((r) => invitationDto(r, accounts, now));
}

/**
 * Send an invitation again (its mail lost, or its link run out): a new link with a new expiry replaces the old one,
 * for the same address, role, account and name. A used or revoked invitation cannot be sent again.
 */
export async function resendInvitation(ctx: AppContext, actor: SessionUser, id: number): Promise<InvitationDto> {
  const t = await ctx.dataSource.getRepository(AuthToken).findOneBy({ id, kind: "invitation", usedAt: IsNull(), revokedAt: IsNull() });
  if (!t) throw notFound("That invitation");
  return invite(ctx, actor, { email: t.email, role: t.role ?? "buyer", accountId: t.accountId, name: t.name ?? undefined });
}

export async function invite(
  ctx: AppContext,
  actor: SessionUser,
  input: { email: string; role: Role; accountId?: number | null; name?: string },
): Promise<InvitationDto> {
  if (await ctx.dataSource.getRepository(User).existsBy({ email: input.email })) {
    throw new HttpError(409, "user_exists", "There is already a sign-in for this e-mail.", { email: "There is already a sign-in for this e-mail." });
  }
  const account = input.role === "buyer" ? await accountForBuyer(ctx, input.accountId) : null;
  const { token, hash } = newLinkToken();
  const now = ctx.clock.now();
  const bakery = await getBakery(ctx);
  const url = `${ctx.config.publicUrl}/set-password?kind=invite&token=${encodeURIComponent(token)}&email=${encodeURIComponent(input.email)}`;
  const mail = invitationMail({ bakeryName: bakery.name, roleLabel: ROLE_LABELS[input.role].toLowerCase(), accountName: account?.businessName ?? null, url, inviterName: actor.name });
  const row = await ctx.dataSource.transaction(async (m) => {
  const repo = m.getRepository(AuthToken);
  // A new invitation to the same address replaces any earlier one still waiting.
  await repo.update({ kind: "invitation", email: input.email, usedAt: IsNull(), revokedAt: IsNull() }, { revokedAt: now });
  const saved = await repo.save(repo.create({
    kind: "invitation",
    tokenHash: hash,
    email: input.email,
    role: input.role,
    accountId: account?.id ?? null,
    name: input.name || null,
    createdById: actor.id,
    expiresAt: new Date(now.getTime() + INVITATION_TTL_MS),
  }));
  // The mail is queued in the same transaction: it goes out once the invitation exists, and is retried if the mail server is down.
  await enqueueMail(m, ctx, "invitation", { to: input.email, fromName: bakery.name, ...mail });
  return saved;
  });
  ctx.logger.info({ event: "invitation_sent", actorId: actor.id, role: input.role }, "invitation sent");
  return invitationDto(row, new Map(account ? [[account.id, account.businessName]] : []), now);
}

export async function revokeInvitation(ctx: AppContext, id: number): Promise<void> {
  const res = await ctx.dataSource.getRepository(AuthToken).update({ id, kind: "invitation", usedAt: IsNull(), revokedAt: IsNull() }, { revokedAt: ctx.clock.now() });
  if (!res.affected) throw notFound("That invitation");
}

export async function userCounts(ctx: AppContext): Promise<OfficeSummaryDto["users"]> {
  const repo = ctx.dataSource.getRepository(User);
  const [total, disabled] = await Promise.all([repo.count(), repo.countBy({ disabled: true })]);
  const pendingInvitations = await ctx.dataSource.getRepository(AuthToken).countBy({ kind: "invitation", usedAt: IsNull(), revokedAt: IsNull(), expiresAt: MoreThan(ctx.clock.now()) });
  return { total, active: total - disabled, disabled, pendingInvitations };
}

