import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { idParamSchema } from "../../shared/schemas/common";
import { invitationCreateSchema, userListQuerySchema, userUpdateSchema } from "../../shared/schemas/users";
import * as users from "./users.service";

export function usersRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner"));

  r.get("/", async (req, res) => {
    const { q } = parse(userListQuerySchema, req.query);
    res.json({ users: await users.listUsers(ctx, q) });
  });
  r.get("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ user: await users.getUser(ctx, id) });
  });
  r.patch("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const patch = parse(userUpdateSchema, req.body);
    res.json({ user: await users.updateUser(ctx, currentUser(req), id, patch) });
  });
  return r;
}

export function invitationsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(allow("owner"));

  r.get("/", async (_req, res) => {
    res.json({ invitations: await users.listInvitations(ctx) });
  });
  r.post("/", async (req, res) => {
    const input = parse(invitationCreateSchema, req.body);
    res.status(201).json({ invitation: await users.invite(ctx, currentUser(req), input) });
  });
  r.post("/:id/resend", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.status(201).json({ invitation: await users.resendInvitation(ctx, currentUser(req), id) });
  });
  r.delete("/:id", async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    await users.revokeInvitation(ctx, id);
    res.status(204).end();
  });
  return r;
}
