import { Router } from "express";
import type { AppContext } from "../http/context";
import { notFound, parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { ROLES } from "../../shared/roles";
import { idParamSchema } from "../../shared/schemas/common";
import { accountDeliverySchema, calendarQuerySchema, calendarSettingsSchema } from "../../shared/schemas/calendar";
import { CustomerAccount } from "../accounts/account.entity";
import { PriceList } from "../catalog/price-list.entity";
import { badRequest } from "../http/errors";
import * as calendar from "./calendar.service";
import { materialiseAll } from "../orders/standing.service";
import type { AccountDeliveryDto } from "../../shared/contracts/billing";

export function calendarRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/", allow(...ROLES), async (req, res) => {
    const q = parse(calendarQuerySchema, req.query);
    res.json({ days: await calendar.calendarFor(ctx, currentUser(req), q) });
  });
  return r;
}

export function settingsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/calendar", allow(...ROLES), async (_req, res) => {
    res.json({ settings: await calendar.getSettingsDto(ctx) });
  });
  r.put("/calendar", allow("owner"), async (req, res) => {
    const input = parse(calendarSettingsSchema, req.body);
    const settings = await calendar.putSettings(ctx, input);
    // New closed dates (or delivery days) take effect on standing orders now, not at the job's next run.
    await materialiseAll(ctx);
    res.json({ settings });
  });
  return r;
}

/** Per account: route days, minimum order and price list (owner). */
export function accountDeliveryRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/:id/delivery", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const account = await calendar.resolveAccount(ctx, currentUser(req), currentUser(req).role === "buyer" ? id : id);
    res.json({ delivery: { routeWeekdays: calendar.parseWeekdays(account.routeWeekdays), minimumOrderCents: account.minimumOrderCents, priceListId: account.priceListId } satisfies AccountDeliveryDto });
  });
  r.put("/:id/delivery", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const input = parse(accountDeliverySchema, req.body);
    const repo = ctx.dataSource.getRepository(CustomerAccount);
    if (!(await repo.existsBy({ id }))) throw notFound("That account");
    if (input.priceListId && !(await ctx.dataSource.getRepository(PriceList).existsBy({ id: input.priceListId }))) {
      throw badRequest("Choose an existing price list.", { priceListId: "Choose an existing price list." });
    }
    await repo.update({ id }, { routeWeekdays: calendar.formatWeekdays(input.routeWeekdays), minimumOrderCents: input.minimumOrderCents, priceListId: input.priceListId });
    res.json({ delivery: input satisfies AccountDeliveryDto });
  });
  return r;
}
