import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse, unauthorized } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { invitationAcceptSchema, passwordResetConfirmSchema, passwordResetRequestSchema, signInSchema } from "../../shared/schemas/auth";
import { ROLES } from "../../shared/roles";
import * as auth from "./auth.service";
import { findUsableToken } from "./auth.service";
import { rateLimits } from "../http/rate-limits";

export function authRoutes(ctx: AppContext): Router {
  const r = Router();
  const limits = rateLimits(ctx);

  r.post("/sign-in", async (req, res) => {
    const body = parse(signInSchema, req.body);
    res.json(await auth.signIn(ctx, body.email, body.password, req.ip || "unknown"));
  });

  r.get("/me", allow(...ROLES), async (req, res) => {
    if (!req.user) throw unauthorized();
    res.json({ user: currentUser(req) });
  });

  /** Ends the session on the server: this token, and every other one of this user, is refused from now on. */
  r.post("/sign-out", allow(...ROLES), async (req, res) => {
    await auth.signOut(ctx, currentUser(req).id);
    res.status(204).end();
  });

  r.post("/password-reset", async (req, res) => {
    const body = parse(passwordResetRequestSchema, req.body);
    await auth.requestPasswordReset(ctx, body.email, req.ip || "unknown");
    res.status(202).json({ message: "If that e-mail has a sign-in, a reset link is on its way. It works for 1 hour." });
  });

  r.post("/password-reset/confirm", limits.tokenCheck, async (req, res) => {
    const body = parse(passwordResetConfirmSchema, req.body);
    res.json(await auth.confirmPasswordReset(ctx, body.token, body.password));
  });

  /** Lets the set-password screen say up front whether a link still works, and for whom. */
  r.get("/invitations/:token", limits.tokenCheck, async (req, res) => {
    const row = await findUsableToken(ctx, "invitation", String(req.params.token));
    res.json(auth.invitationPreview(row));
  });

  r.post("/invitations/accept", limits.tokenCheck, async (req, res) => {
    const body = parse(invitationAcceptSchema, req.body);
    res.json(await auth.acceptInvitation(ctx, body.token, body.password, body.name));
  });

  return r;
}
