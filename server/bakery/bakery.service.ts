import { DateTime } from "luxon";
import type { EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import type { BakeryDto } from "../../shared/schemas/bakery";
import { Bakery } from "./bakery.entity";

/** Inside a transaction pass its manager: taking a second pool connection there can starve the pool. */
export async function getBakery(ctx: AppContext, m: EntityManager = ctx.dataSource.manager): Promise<Bakery> {
  const bakery = await m.getRepository(Bakery).findOne({ where: {}, order: { id: "ASC" } });
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
    locale: bakery.locale,
    email: bakery.email,
    phone: bakery.phone,
    address: bakery.address,
    today: now.toISODate()!,
    now: now.toISO()!,
  };
}
