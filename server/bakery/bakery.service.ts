import { DateTime } from "luxon";
import type { AppContext } from "../http/context";
import type { BakeryDto } from "../../shared/schemas/bakery";
import { Bakery } from "./bakery.entity";

export async function getBakery(ctx: AppContext): Promise<Bakery> {
  const bakery = await ctx.dataSource.getRepository(Bakery).findOne({ where: {}, order: { id: "ASC" } });
  if (!bakery) throw new Error("The bakery row is missing: run the migrations and the seed (npm start does both).");
  return bakery;
}

export function bakeryDto(ctx: AppContext, bakery: Bakery): BakeryDto {
  const now = DateTime.fromJSDate(ctx.clock.now(), { zone: bakery.timeZone });
  return {
    id: bakery.id,
    name: bakery.name,
    timeZone: bakery.timeZone,
    currency: bakery.currency,
    email: bakery.email,
    phone: bakery.phone,
    address: bakery.address,
    today: now.toISODate()!,
    now: now.toISO()!,
  };
}
