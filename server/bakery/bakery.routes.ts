import { Router } from "express";
import type { AppContext } from "../http/context";
import { allow, currentUser } from "../http/auth";
import { officeOverview } from "./overview.service";
import { ROLES } from "../../shared/roles";
import { bakeryDto, getBakery } from "./bakery.service";
import { userCounts } from "../users/users.service";
import { accountCounts } from "../accounts/accounts.service";
import type { OfficeSummaryDto } from "../../shared/schemas/bakery";

export function bakeryRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (_req, res) => {
    res.json({ bakery: bakeryDto(ctx, await getBakery(ctx)) });
  });
  return r;
}

export function officeRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/summary", allow("owner", "bookkeeper"), async (req, res) => {
    const summary: OfficeSummaryDto = { users: await userCounts(ctx), accounts: await accountCounts(ctx), overview: await officeOverview(ctx, currentUser(req).role) };
    res.json({ summary });
  });
  return r;
}
