import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { idParamSchema } from "../../shared/schemas/common";
import { accountInputSchema, accountListQuerySchema, accountUpdateSchema } from "../../shared/schemas/accounts";
import * as accounts from "./accounts.service";

export function accountsRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get("/", allow("owner", "bookkeeper"), async (req, res) => {
    res.json({ accounts: await accounts.listAccounts(ctx, parse(accountListQuerySchema, req.query)) });
  });
  r.get("/:id/buyers", allow("owner", "bookkeeper"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ buyers: await accounts.accountBuyers(ctx, id) });
  });
  /** Buyers may read their own account (anything else is 404 for them). */
  r.get("/:id", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json({ account: await accounts.getAccount(ctx, currentUser(req), id) });
  });
  r.post("/", allow("owner"), async (req, res) => {
    const input = parse(accountInputSchema, req.body);
    res.status(201).json({ account: await accounts.createAccount(ctx, input) });
  });
  r.patch("/:id", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const patch = parse(accountUpdateSchema, req.body);
    res.json({ account: await accounts.updateAccount(ctx, currentUser(req), id, patch) });
  });
  return r;
}
