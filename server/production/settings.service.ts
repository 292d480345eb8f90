import type { EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest } from "../http/errors";
import { Bakery } from "../bakery/bakery.entity";
import { getBakery } from "../bakery/bakery.service";
import { BakehouseMixer } from "./bakehouse-mixer.entity";
import { BakehouseOven } from "./bakehouse-oven.entity";
import { Formula } from "./formula.entity";
import { ProductionSettings } from "./production-settings.entity";
import type { ProductionSettingsDto, ProductionSettingsInput } from "../../shared/schemas/production";
import type { BakehouseResources, OvenSpec } from "../../shared/schedule";

/**
 * Defaults when the bakery has not set its bakehouse up yet: one 20 kg mixer and one oven of six
 * half-sheet-sized slots (what the plan assumed before these settings existed), two people, 30 min packing.
 * The person-minutes are from memory (common practice, no source): about 9 s to divide and round a roll,
 * 12 s to shape it, 30 s to fill and set out a pan.
 */
export const DEFAULT_PRODUCTION_SETTINGS: Omit<ProductionSettingsDto, "dispatchTime"> = {
  shiftStart: null,
  packingMinutes: 30,
  mixers: [{ id: 0, name: "Mixer", capacityKg: 20 }],
  ovens: [{ id: 0, name: "Oven", capacity: { kind: "slots", slots: ["Slot 1", "Slot 2", "Slot 3", "Slot 4", "Slot 5", "Slot 6"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 15, loadMinutes: 2, unloadMinutes: 2 }],
  crew: { people: 2, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
  retard: [],
};

function ovenDto(o: BakehouseOven): OvenSpec {
  return {
    id: o.id,
    name: o.name,
    capacity: o.capacityKind === "area"
      ? { kind: "area", areaCm2: o.areaCm2 ?? 0 }
      : { kind: "slots", slots: JSON.parse(o.slotNames) as string[], slotLengthMm: o.slotLengthMm ?? 0, slotWidthMm: o.slotWidthMm ?? 0 },
    tempChangeMinutes: o.tempChangeMinutes,
    loadMinutes: o.loadMinutes,
    unloadMinutes: o.unloadMinutes,
  };
}

/** The production settings as the API answers them (defaults where nothing is stored yet). */
export async function loadProductionSettings(ctx: AppContext, m: EntityManager = ctx.dataSource.manager): Promise<ProductionSettingsDto> {
  const bakery = await getBakery(ctx, m);
  const row = await m.getRepository(ProductionSettings).findOneBy({ id: 1 });
  const mixers = await m.getRepository(BakehouseMixer).find({ order: { sortOrder: "ASC", id: "ASC" } });
  const ovens = await m.getRepository(BakehouseOven).find({ order: { sortOrder: "ASC", id: "ASC" } });
  const d = DEFAULT_PRODUCTION_SETTINGS;
  return {
    dispatchTime: bakery.dispatchTime,
    shiftStart: row ? row.shiftStart : d.shiftStart,
    packingMinutes: row ? row.packingMinutes : d.packingMinutes,
    mixers: mixers.length ? mixers.map((x) => ({ id: x.id, name: x.name, capacityKg: Number(x.capacityKg) })) : d.mixers,
    ovens: ovens.length ? ovens.map(ovenDto) : d.ovens,
    crew: row
      ? { people: row.crewPeople, divideMinutesPerPiece: Number(row.divideMinutesPerPiece), shapeMinutesPerPiece: Number(row.shapeMinutesPerPiece), panMinutesPerPan: Number(row.panMinutesPerPan) }
      : d.crew,
    retard: row ? (JSON.parse(row.retard) as ProductionSettingsDto["retard"]) : d.retard,
  };
}

/** What the scheduler needs from the settings. */
export function resourcesOf(s: ProductionSettingsDto): BakehouseResources {
  return { mixers: s.mixers, ovens: s.ovens, crew: s.crew, packingMinutes: s.packingMinutes, shiftStart: s.shiftStart ?? "00:00" };
}

/** Replace the settings whole (owner only): mixers and ovens are written again in the order given. */
export async function saveProductionSettings(ctx: AppContext, input: ProductionSettingsInput): Promise<ProductionSettingsDto> {
  return ctx.dataSource.transaction(async (m) => {
    const ids = input.retard.map((r) => r.formulaId);
    if (ids.length) {
      const found = await m.getRepository(Formula).countBy(ids.map((id) => ({ id })));
      if (found !== ids.length) throw badRequest("A dough to retard is not among the formulas.", { retard: "Choose doughs from the formulas." });
    }
    const bakery = await getBakery(ctx, m);
    await m.getRepository(Bakery).update({ id: bakery.id }, { dispatchTime: input.dispatchTime });
    await m.getRepository(ProductionSettings).save({
      id: 1,
      crewPeople: input.crew.people,
      divideMinutesPerPiece: String(input.crew.divideMinutesPerPiece),
      shapeMinutesPerPiece: String(input.crew.shapeMinutesPerPiece),
      panMinutesPerPan: String(input.crew.panMinutesPerPan),
      packingMinutes: input.packingMinutes,
      shiftStart: input.shiftStart,
      retard: JSON.stringify(input.retard),
    });
    await m.createQueryBuilder().delete().from(BakehouseMixer).execute();
    await m.createQueryBuilder().delete().from(BakehouseOven).execute();
    await m.getRepository(BakehouseMixer).insert(input.mixers.map((x, i) => ({ name: x.name, capacityKg: String(x.capacityKg), sortOrder: i })));
    await m.getRepository(BakehouseOven).insert(input.ovens.map((o, i) => ({
      name: o.name,
      capacityKind: o.capacity.kind,
      areaCm2: o.capacity.kind === "area" ? o.capacity.areaCm2 : null,
      slotNames: JSON.stringify(o.capacity.kind === "slots" ? o.capacity.slots : []),
      slotLengthMm: o.capacity.kind === "slots" ? o.capacity.slotLengthMm : null,
      slotWidthMm: o.capacity.kind === "slots" ? o.capacity.slotWidthMm : null,
      tempChangeMinutes: o.tempChangeMinutes,
      loadMinutes: o.loadMinutes,
      unloadMinutes: o.unloadMinutes,
      sortOrder: i,
    })));
    return loadProductionSettings(ctx, m);
  });
}
