import type { NextFunction, Request, RequestHandler, Response } from "express";
import jwt from "jsonwebtoken";
import type { Role } from "../../shared/roles";
import type { SessionUser } from "../../shared/schemas/auth";
import type { AppContext } from "./context";
import { User } from "../users/user.entity";
import { forbidden, unauthorized } from "./errors";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
    }
  }
}

export function signToken(ctx: AppContext, user: User): string {
  // iat from the server clock, so expiry follows the same clock that checks it. `ver` is the user's token version:
  // bumping it (password reset, role change, turned off, sign-out) ends every token issued before.
  return jwt.sign({ sub: String(user.id), role: user.role, ver: user.tokenVersion, iat: Math.floor(ctx.clock.now().getTime() / 1000) }, ctx.config.jwtSecret, {
    expiresIn: ctx.config.jwtTtlSeconds,
    algorithm: "HS256",
  });
}

export function toSessionUser(user: User): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, accountId: user.accountId };
}

/**
 * Reads the bearer token and loads the user from the database on every request, so a
 * disabled user or a changed role takes effect at once, on every server instance; a token whose
 * version is not the user's current one (signed out, password reset, role changed) is refused.
 */
export function authenticate(ctx: AppContext): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const header = req.get("authorization") || "";
    const match = /^Bearer\s+(.+)$/i.exec(header);
    if (!match) return next();
    let sub: string;
    let ver: unknown;
    try {
      const payload = jwt.verify(match[1], ctx.config.jwtSecret, { algorithms: ["HS256"], clockTimestamp: Math.floor(ctx.clock.now().getTime() / 1000) });
      sub = typeof payload === "object" && payload && typeof payload.sub === "string" ? payload.sub : "";
      ver = typeof payload === "object" && payload ? (payload as { ver?: unknown }).ver : undefined;
    } catch {
      return next(unauthorized("Your session has expired. Sign in again."));
    }
    const id = Number(sub);
    if (!Number.isInteger(id) || id <= 0) return next(unauthorized("Your session is not valid. Sign in again."));
    const user = await ctx.dataSource.getRepository(User).findOneBy({ id });
    if (!user || user.disabled) return next(unauthorized("This sign-in is no longer active. Ask the bakery's owner."));
    if (typeof ver !== "number" || ver !== user.tokenVersion) return next(unauthorized("Your session has ended. Sign in again."));
    req.user = toSessionUser(user);
    next();
  };
}

/** Deny by default: a route must name the roles allowed to use it. */
export function allow(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) return next(forbidden());
    next();
  };
}

export function currentUser(req: Request): SessionUser {
  if (!req.user) throw unauthorized();
  return req.user;
}
