import bcrypt from "bcryptjs";
import { IsNull, MoreThan } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest } from "../http/errors";
import { signToken, toSessionUser } from "../http/auth";
import { User } from "../users/user.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { AuthToken } from "./auth-token.entity";
import { SignInFailure } from "./sign-in-attempt.entity";
import { RESET_TTL_MS, hashToken, newLinkToken } from "./tokens";
import { getBakery } from "../bakery/bakery.service";
import { passwordResetMail } from "../mail/templates";
import { enqueueMail } from "../mail/outbox.service";
import type { SignInResponse } from "../../shared/schemas/auth";

export const BCRYPT_ROUNDS = Number(process.env.BCRYPT_ROUNDS || 11);
const WINDOW_MS = 15 * 60 * 1000;
const MAX_FAILURES = 10;
const BAD_CREDENTIALS = "That e-mail and password don't match a sign-in. Check both and try again.";

/** A hash to compare against when the e-mail is unknown, so both cases take the same time. */
let dummyHash: string | null = null;
const getDummyHash = () => (dummyHash ??= bcrypt.hashSync("no-such-user-password", BCRYPT_ROUNDS));

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);

/** More than 10 failures for this e-mail or this IP in 15 minutes: refuse with 429 and Retry-After. */
async function checkRateLimit(ctx: AppContext, email: string, ip: string) {
  const now = ctx.clock.now();
  const since = new Date(now.getTime() - WINDOW_MS);
  const repo = ctx.dataSource.getRepository(SignInFailure);
  for (const where of [{ email, at: MoreThan(since) }, { ip, at: MoreThan(since) }]) {
    const count = await repo.countBy(where);
    if (count >= MAX_FAILURES) {
      // The oldest failure that still counts leaves the window first.
      const oldest = await repo.find({ where, order: { at: "DESC" }, skip: MAX_FAILURES - 1, take: 1 });
      const freeAt = (oldest[0]?.at.getTime() ?? now.getTime()) + WINDOW_MS;
      const retryAfter = Math.max(1, Math.ceil((freeAt - now.getTime()) / 1000));
      throw new HttpError(429, "too_many_attempts", `Too many sign-in attempts. Try again in ${Math.ceil(retryAfter / 60)} minute${retryAfter > 60 ? "s" : ""}, or reset your password.`, undefined, { retryAfterSeconds: retryAfter }, { "Retry-After": String(retryAfter) });
    }
  }
}

export async function signIn(ctx: AppContext, email: string, password: string, ip: string): Promise<SignInResponse> {
  await checkRateLimit(ctx, email, ip);
  const users = ctx.dataSource.getRepository(User);
  const user = await users.findOneBy({ email });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? getDummyHash());
  if (!user || !ok) {
    await ctx.dataSource.getRepository(SignInFailure).insert({ email, ip, at: ctx.clock.now() });
    throw new HttpError(401, "invalid_credentials", BAD_CREDENTIALS);
  }
  if (user.disabled) {
    throw new HttpError(403, "user_disabled", "This sign-in has been turned off. Ask the bakery's owner to turn it back on.");
  }
  user.lastSignInAt = ctx.clock.now();
  await users.update({ id: user.id }, { lastSignInAt: user.lastSignInAt });
  return { token: signToken(ctx, user), user: toSessionUser(user) };
}

/** Always succeeds from the caller's view; sends a link only when the e-mail belongs to an active user. */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const user = await ctx.dataSource.getRepository(User).findOneBy({ email });
  if (!user || user.disabled) {
    ctx.logger.info({ event: "password_reset_unknown" }, "password reset asked for an unknown or disabled e-mail");
    return;
  }
  const { token, hash } = newLinkToken();
  const bakery = await getBakery(ctx);
  const url = `${ctx.config.publicUrl}/set-password?kind=reset&token=${encodeURIComponent(token)}`;
  const mail = passwordResetMail({ bakeryName: bakery.name, name: user.name, url });
  await ctx.dataSource.transaction(async (m) => {
    await m.getRepository(AuthToken).insert({
      kind: "password_reset",
      tokenHash: hash,
      email: user.email,
      userId: user.id,
      expiresAt: new Date(ctx.clock.now().getTime() + RESET_TTL_MS),
    });
    await enqueueMail(m, ctx, "password_reset", { to: user.email, fromName: bakery.name, ...mail });
  });
}

/** Find a usable token of this kind, or explain why the link no longer works. */
export async function findUsableToken(ctx: AppContext, kind: AuthToken["kind"], token: string): Promise<AuthToken> {
  const row = await ctx.dataSource.getRepository(AuthToken).findOneBy({ tokenHash: hashToken(token), kind });
  const what = kind === "invitation" ? "invitation link" : "reset link";
  if (!row || row.revokedAt) throw new HttpError(400, "invalid_token", `This ${what} is not valid. Ask for a new one.`, { token: `This ${what} is not valid.` });
  if (row.usedAt) throw new HttpError(400, "token_used", `This ${what} has already been used. Sign in, or ask for a new one.`, { token: "Already used." });
  if (row.expiresAt.getTime() <= ctx.clock.now().getTime()) {
    throw new HttpError(400, "token_expired", `This ${what} has expired. Ask for a new one.`, { token: "Expired." });
  }
  return row;
}

/** Mark a token used, atomically: a second concurrent use finds it already taken. */
async function consume(ctx: AppContext, manager: import("typeorm").EntityManager, row: AuthToken) {
  const res = await manager.getRepository(AuthToken).update({ id: row.id, usedAt: IsNull() }, { usedAt: ctx.clock.now() });
  if (!res.affected) throw new HttpError(400, "token_used", "This link has already been used.", { token: "Already used." });
}

export async function confirmPasswordReset(ctx: AppContext, token: string, password: string): Promise<SignInResponse> {
  const row = await findUsableToken(ctx, "password_reset", token);
  const passwordHash = await hashPassword(password);
  const user = await ctx.dataSource.transaction(async (m) => {
    await consume(ctx, m, row);
    const u = await m.getRepository(User).findOneBy({ id: row.userId ?? -1 });
    if (!u || u.disabled) throw new HttpError(400, "invalid_token", "This reset link is not valid any more.");
    await m.getRepository(User).update({ id: u.id }, { passwordHash, lastSignInAt: ctx.clock.now() });
    // Other reset links for the same user stop working too.
    await m.getRepository(AuthToken).update({ userId: u.id, kind: "password_reset", usedAt: IsNull() }, { revokedAt: ctx.clock.now() });
    return u;
  });
  return { token: signToken(ctx, user), user: toSessionUser(user) };
}

export async function acceptInvitation(ctx: AppContext, token: string, password: string, name: string): Promise<SignInResponse> {
  const row = await findUsableToken(ctx, "invitation", token);
  const passwordHash = await hashPassword(password);
  const user = await ctx.dataSource.transaction(async (m) => {
    await consume(ctx, m, row);
    if (await m.getRepository(User).existsBy({ email: row.email })) {
      throw new HttpError(409, "user_exists", "There is already a sign-in for this e-mail. Sign in or reset your password.");
    }
    if (row.role === "buyer") {
      const account = await m.getRepository(CustomerAccount).findOneBy({ id: row.accountId ?? -1 });
      if (!account || account.status === "closed") throw badRequest("The customer account for this invitation is closed. Ask the bakery.");
    }
    const created = m.getRepository(User).create({
      email: row.email,
      name,
      role: row.role ?? "buyer",
      accountId: row.role === "buyer" ? row.accountId : null,
      passwordHash,
      disabled: false,
      lastSignInAt: ctx.clock.now(),
    });
    return m.getRepository(User).save(created);
  });
  return { token: signToken(ctx, user), user: toSessionUser(user) };
}

/** Drop expired tokens and old sign-in failures (a scheduled job). */
export async function purgeExpired(ctx: AppContext): Promise<void> {
  const now = ctx.clock.now();
  await ctx.dataSource.createQueryBuilder().delete().from(SignInFailure).where("at < :t", { t: new Date(now.getTime() - WINDOW_MS) }).execute();
  await ctx.dataSource.createQueryBuilder().delete().from(AuthToken)
    .where("expiresAt < :t", { t: new Date(now.getTime() - 30 * 24 * 3600 * 1000) }).execute();
}
