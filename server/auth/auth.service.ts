import { performance } from "node:perf_hooks";
import { IsNull } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest } from "../http/errors";
import { signToken, toSessionUser } from "../http/auth";
import { User } from "../users/user.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { AuthToken } from "./auth-token.entity";
import { RESET_TTL_MS, hashToken, newLinkToken } from "./tokens";
import { admitHashing, hashPassword, needsRehash, verifyPassword } from "./password-hash";
import { assertNotCommonPassword } from "./password-policy";
import { bump, countIn, giveBack, purgeCounters, takeSlots, type RateLimit, type Refusal } from "./rate-limit";
import { purgeRateLimits } from "../http/rate-limits";
import { getBakery } from "../bakery/bakery.service";
import { passwordResetMail } from "../mail/templates";
import { enqueueMail } from "../mail/outbox.service";
import type { SignInResponse } from "../../shared/schemas/auth";
import type { InvitationPreviewDto } from "../../shared/contracts/auth";

export { hashPassword, verifyPassword } from "./password-hash";

const BAD_CREDENTIALS = "That e-mail and password don't match a sign-in. Check both and try again.";

// ---- sign-in limits ----
// OWASP Authentication Cheat Sheet, "Protect Against Automated Attacks" / "Account Lockout": count failures in an
// observation window and lock for a while; lockout can itself be abused to keep a user out, so the lock here is per
// (e-mail, address) and per address, and an e-mail attacked from many addresses is only slowed down, never refused.
// The figures are common practice, no source: 10 failures per e-mail and address, 30 per address (a café's shared
// connection), in 15 minutes.

const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const SIGN_IN_MAX_PER_PAIR = 10;
export const SIGN_IN_MAX_PER_ADDRESS = 30;
/** From this many failures for one e-mail (all addresses together) each attempt on it waits first… */
export const SLOWDOWN_AFTER = 10;
/** …half a second more per further failure, at most 5 s (common practice, no source). */
const SLOWDOWN_STEP_MS = 500;
const SLOWDOWN_MAX_MS = 5000;

const pairLimit = (email: string, ip: string): RateLimit => ({ scope: "sign_in_pair", key: `${email}\n${ip}`, max: SIGN_IN_MAX_PER_PAIR, windowMs: SIGN_IN_WINDOW_MS });
const addressLimit = (ip: string): RateLimit => ({ scope: "sign_in_address", key: ip, max: SIGN_IN_MAX_PER_ADDRESS, windowMs: SIGN_IN_WINDOW_MS });
const emailFailures = (email: string): RateLimit => ({ scope: "sign_in_email", key: email, max: Number.MAX_SAFE_INTEGER, windowMs: SIGN_IN_WINDOW_MS });

/** How long an attempt on this e-mail waits, from the failures it had in the window from every address. */
export function slowdownMs(failures: number): number {
  return failures < SLOWDOWN_AFTER ? 0 : Math.min(SLOWDOWN_MAX_MS, SLOWDOWN_STEP_MS * (failures - SLOWDOWN_AFTER + 1));
}

function tooManyAttempts(refusal: Refusal): HttpError {
  const s = refusal.retryAfterSeconds;
  const minutes = Math.ceil(s / 60);
  return new HttpError(
    429,
    "too_many_attempts",
    `Too many sign-in attempts from here. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}, or reset your password.`,
    undefined,
    { retryAfterSeconds: s },
    { "Retry-After": String(s) },
  );
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function signIn(ctx: AppContext, email: string, password: string, ip: string): Promise<SignInResponse> {
  // Admission first (a 503 when the hashing queue could not take this one), so a burst does no database work beyond
  // what the hashing cap lets through. A request waiting out the slow-down gives its admission back meanwhile.
  let release = admitHashing();
  try {
    return await signInAdmitted(ctx, email, password, ip, async (ms) => {
      release();
      await sleep(ms);
      release = admitHashing();
    });
  } finally {
    release();
  }
}

async function signInAdmitted(ctx: AppContext, email: string, password: string, ip: string, wait: (ms: number) => Promise<void>): Promise<SignInResponse> {
  // A slot in both counters is taken before the password is looked at, atomically: under any concurrency at most
  // the limit of attempts is evaluated. A wrong password keeps its slot; anything else gives it back.
  const slots = [pairLimit(email, ip), addressLimit(ip)];
  const refusal = await takeSlots(ctx, slots);
  if (refusal) throw tooManyAttempts(refusal);
  let keepSlots = false;
  try {
    const delay = slowdownMs(await countIn(ctx, emailFailures(email)));
    if (delay) await wait(delay);
    const users = ctx.dataSource.getRepository(User);
    const user = await users.findOneBy({ email });
    const ok = await verifyPassword(password, user?.passwordHash ?? null);
    if (!user || !ok) {
      keepSlots = true;
      await bump(ctx, emailFailures(email));
      throw new HttpError(401, "invalid_credentials", BAD_CREDENTIALS);
    }
    if (user.disabled) {
      throw new HttpError(403, "user_disabled", "This sign-in has been turned off. Ask the bakery's owner to turn it back on.");
    }
    const now = ctx.clock.now();
    // A bcrypt-era hash (or older scrypt parameters) is replaced now that the password is known to be right.
    const upgraded = needsRehash(user.passwordHash) ? await hashPassword(password) : null;
    await users.update({ id: user.id }, { lastSignInAt: now, ...(upgraded ? { passwordHash: upgraded } : {}) });
    if (upgraded) ctx.logger.info({ event: "password_rehashed", userId: user.id }, "password hash upgraded to scrypt");
    return { token: signToken(ctx, user), user: toSessionUser(user) };
  } finally {
    if (!keepSlots) await giveBack(ctx, slots);
  }
}

/** Ends every session of this user on the server: tokens issued before are refused from now on. */
export async function signOut(ctx: AppContext, userId: number): Promise<void> {
  await ctx.dataSource.getRepository(User).update({ id: userId }, { tokenVersion: () => "tokenVersion + 1" });
  ctx.logger.info({ event: "signed_out", userId }, "signed out");
}

// ---- password reset ----
// OWASP Forgot Password Cheat Sheet: the same answer for known and unknown e-mails, returned in a consistent time
// ("making sure that the same logic is followed, instead of using a quick exit method"), and rate limiting so the
// feature cannot flood a mailbox. Limits (common practice, no source): 3 links per e-mail and 10 requests per
// address an hour.

const RESET_WINDOW_MS = 60 * 60 * 1000;
export const RESET_MAX_PER_EMAIL = 3;
export const RESET_MAX_PER_ADDRESS = 10;
/** Every answer takes at least this long, so the remaining difference (one outbox row) cannot be timed. */
export const RESET_MIN_RESPONSE_MS = 150;

export async function requestPasswordReset(ctx: AppContext, email: string, ip: string): Promise<void> {
  const started = performance.now();
  try {
    const refusal = await takeSlots(ctx, [
      { scope: "reset_email", key: email, max: RESET_MAX_PER_EMAIL, windowMs: RESET_WINDOW_MS },
      { scope: "reset_address", key: ip, max: RESET_MAX_PER_ADDRESS, windowMs: RESET_WINDOW_MS },
    ]);
    if (refusal) {
      const minutes = Math.ceil(refusal.retryAfterSeconds / 60);
      throw new HttpError(
        429,
        "too_many_resets",
        `Several reset links were asked for already. Use the newest e-mail, or try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`,
        undefined,
        { retryAfterSeconds: refusal.retryAfterSeconds },
        { "Retry-After": String(refusal.retryAfterSeconds) },
      );
    }
    // The same steps whether or not the e-mail has a sign-in: look-up, token and its hash, bakery, mail text, and one
    // transaction writing an auth_token row. Only a real, active user gets a usable row and a queued mail.
    const user = await ctx.dataSource.getRepository(User).findOneBy({ email });
    const target = user && !user.disabled ? user : null;
    const { token, hash } = newLinkToken();
    const bakery = await getBakery(ctx);
    const url = `${ctx.config.publicUrl}/set-password?kind=reset&token=${encodeURIComponent(token)}`;
    const mail = passwordResetMail({ bakeryName: bakery.name, name: user?.name ?? "", url });
    const now = ctx.clock.now();
    await ctx.dataSource.transaction(async (m) => {
      await m.getRepository(AuthToken).insert({
        kind: "password_reset",
        tokenHash: hash,
        email,
        userId: target ? target.id : null,
        expiresAt: new Date(now.getTime() + RESET_TTL_MS),
        // Nobody holds this link: the row exists so both cases write the same, and it can never be used.
        revokedAt: target ? null : now,
      });
      if (target) await enqueueMail(m, ctx, "password_reset", { to: target.email, fromName: bakery.name, ...mail });
    });
    if (!target) ctx.logger.info({ event: "password_reset_unknown" }, "password reset asked for an unknown or disabled e-mail");
  } finally {
    const left = RESET_MIN_RESPONSE_MS - (performance.now() - started);
    if (left > 0) await sleep(left);
  }
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

/** Who a usable invitation is for (GET /api/auth/invitations/:token). An invitation row always names its role. */
export function invitationPreview(row: AuthToken): InvitationPreviewDto {
  return { email: row.email, role: row.role!, name: row.name };
}

/** Mark a token used, atomically: a second concurrent use finds it already taken. */
async function consume(ctx: AppContext, manager: import("typeorm").EntityManager, row: AuthToken) {
  const res = await manager.getRepository(AuthToken).update({ id: row.id, usedAt: IsNull() }, { usedAt: ctx.clock.now() });
  if (!res.affected) throw new HttpError(400, "token_used", "This link has already been used.", { token: "Already used." });
}

export async function confirmPasswordReset(ctx: AppContext, token: string, password: string): Promise<SignInResponse> {
  const row = await findUsableToken(ctx, "password_reset", token);
  assertNotCommonPassword(password);
  const passwordHash = await hashPassword(password);
  const user = await ctx.dataSource.transaction(async (m) => {
    await consume(ctx, m, row);
    const u = await m.getRepository(User).findOneBy({ id: row.userId ?? -1 });
    if (!u || u.disabled) throw new HttpError(400, "invalid_token", "This reset link is not valid any more.");
    // A new password ends every earlier session (tokenVersion + 1): whoever knew the old one is signed out.
    await m.getRepository(User).update({ id: u.id }, { passwordHash, lastSignInAt: ctx.clock.now(), tokenVersion: () => "tokenVersion + 1" });
    // Other reset links for the same user stop working too.
    await m.getRepository(AuthToken).update({ userId: u.id, kind: "password_reset", usedAt: IsNull() }, { revokedAt: ctx.clock.now() });
    return m.getRepository(User).findOneByOrFail({ id: u.id });
  });
  return { token: signToken(ctx, user), user: toSessionUser(user) };
}

export async function acceptInvitation(ctx: AppContext, token: string, password: string, name: string): Promise<SignInResponse> {
  const row = await findUsableToken(ctx, "invitation", token);
  assertNotCommonPassword(password);
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
      // A new user: no earlier token exists, so the version starts where every user's does.
      tokenVersion: 0,
    });
    return m.getRepository(User).save(created);
  });
  return { token: signToken(ctx, user), user: toSessionUser(user) };
}

/** Drop expired tokens and finished rate-limit windows, both kinds (a scheduled job). */
export async function purgeExpired(ctx: AppContext): Promise<void> {
  const now = ctx.clock.now();
  await purgeCounters(ctx, Math.max(SIGN_IN_WINDOW_MS, RESET_WINDOW_MS));
  await purgeRateLimits(ctx);
  await ctx.dataSource.createQueryBuilder().delete().from(AuthToken)
    .where("expiresAt < :t", { t: new Date(now.getTime() - 30 * 24 * 3600 * 1000) }).execute();
}
