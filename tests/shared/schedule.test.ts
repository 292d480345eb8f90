import { DateTime } from "luxon";
import { minutesText, panAreaCm2, scheduleDay, type BakehouseResources, type OvenSpec, type ScheduleInput, type ScheduleProduct } from "../../shared/schedule";
import type { StepSpec } from "../../shared/production";
import { scheduleProblems } from "./schedule-checks";

/**
 * The one schedule of a bake day. Durations here are invented round figures, worked by hand; trade facts are
 * marked common practice. Pan sizes are the usual US ones: a 9×13 in pan 330 × 229 mm, a half sheet
 * 457 × 330 mm, a 13×4 in Pullman 330 × 102 mm (nominal inches × 25.4 mm, NIST SP 811: 1 in = 25.4 mm exactly).
 */
const ROLL_STEPS: StepSpec[] = [
  { kind: "paste", minutes: 40 }, { kind: "mix", minutes: 15 }, { kind: "bulk", minutes: 60 }, { kind: "divide", minutes: 25 },
  { kind: "bench", minutes: 10 }, { kind: "shape", minutes: 25 }, { kind: "proof", minutes: 50 }, { kind: "wash", minutes: 5 },
  { kind: "bake", minutes: 20, temperatureC: 177 }, { kind: "cool", minutes: 60 },
];
const BRIOCHE_STEPS: StepSpec[] = [
  { kind: "mix", minutes: 20 }, { kind: "bulk", minutes: 75 }, { kind: "divide", minutes: 20 }, { kind: "bench", minutes: 10 }, { kind: "shape", minutes: 25 },
  { kind: "proof", minutes: 70 }, { kind: "wash", minutes: 5 }, { kind: "bake", minutes: 16, temperatureC: 190 }, { kind: "cool", minutes: 60 },
];
const NINE_BY_THIRTEEN = { panLengthMm: 330, panWidthMm: 229 };
const HALF_SHEET = { panLengthMm: 457, panWidthMm: 330 };
const PULLMAN = { panLengthMm: 330, panWidthMm: 102 };

const deck = (over: Partial<OvenSpec> = {}): OvenSpec => ({ id: 1, name: "Deck oven", capacity: { kind: "area", areaCm2: 9100 }, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 2, ...over });
const convection = (over: Partial<OvenSpec> = {}): OvenSpec => ({
  id: 2, name: "Convection oven", capacity: { kind: "slots", slots: ["Shelf 1", "Shelf 2", "Shelf 3", "Shelf 4", "Shelf 5"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 10, loadMinutes: 2, unloadMinutes: 2, ...over,
});
const resources = (over: Partial<BakehouseResources> = {}): BakehouseResources => ({
  mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 20 }],
  ovens: [deck()],
  crew: { people: 1, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
  packingMinutes: 30,
  shiftStart: "00:00",
  ...over,
});
const product = (over: Partial<ScheduleProduct> & Pick<ScheduleProduct, "productId" | "pans">): ScheduleProduct => ({
  name: `Product ${over.productId}`, formulaId: 1, pieces: over.pans * 15, pieceGrams: 67, ...NINE_BY_THIRTEEN, bakeTempC: null, bakeMinutes: null, coolMinutes: null, ...over,
});
const input = (over: Partial<ScheduleInput> = {}): ScheduleInput => ({
  date: "2026-06-11", timeZone: "America/Chicago", dispatchTime: "06:30", resources: resources(),
  formulas: [{ id: 1, name: "Milk bread", steps: ROLL_STEPS, retardHours: null }, { id: 3, name: "Brioche", steps: BRIOCHE_STEPS, retardHours: null }],
  products: [product({ productId: 1, pans: 10 })],
  mixes: [{ formulaId: 1, index: 1, doughGrams: 10255 }],
  ...over,
});
const hm = (iso: string) => iso.slice(11, 16);
const check = (i: ScheduleInput, s = scheduleDay(i)) => scheduleProblems({
  entries: s.entries, schedule: s, cards: i.mixes.map((m) => ({ formulaId: m.formulaId, index: m.index })), ovens: i.resources.ovens, packingMinutes: i.resources.packingMinutes,
  products: i.products.map((p) => ({ productId: p.productId, pans: p.pans, panLengthMm: p.panLengthMm, panWidthMm: p.panWidthMm, formulaId: p.formulaId })),
});

describe("working back from dispatch, by hand", () => {
  it("places every step of one dough: packing, cooling, unloading, the bake, loading, wash, proof, shaping, bench, dividing, bulk, mix, paste", () => {
    const s = scheduleDay(input());
    const at = (step: string) => s.entries.find((e) => e.step === step)!;
    // 06:30 dispatch − 30 min packing = 06:00; cooling 60 min → the oven is empty by 05:00;
    // unload 2 → bake ends 04:58; bake 20 → 04:38; load 3 → the oven is taken from 04:35.
    expect(hm(s.packFrom)).toBe("06:00");
    expect([hm(at("cool").startsAt), hm(at("cool").endsAt)]).toEqual(["05:00", "06:00"]);
    expect(s.ovenLoads).toHaveLength(1);
    expect([hm(s.ovenLoads[0].startsAt), hm(s.ovenLoads[0].endsAt)]).toEqual(["04:35", "05:00"]);
    expect([hm(at("bake").startsAt), hm(at("bake").endsAt), at("bake").temperatureC]).toEqual(["04:38", "04:58", 177]);
    // wash 5 → 04:30; proof 50 → 03:40; shaping by one person: 150 pieces × 0.2 + 10 pans × 0.5 = 35 min → 03:05;
    // bench 10 → 02:55; dividing 150 × 0.15 = 22.5 → 23 min → 02:32; bulk 60 → 01:32; mix 15 → 01:17; paste 40 → 00:37.
    expect([hm(at("wash").startsAt), hm(at("proof").startsAt), hm(at("shape").startsAt), hm(at("bench").startsAt)]).toEqual(["04:30", "03:40", "03:05", "02:55"]);
    expect([hm(at("divide").startsAt), hm(at("bulk").startsAt), hm(at("mix").startsAt), hm(at("paste").startsAt)]).toEqual(["02:32", "01:32", "01:17", "00:37"]);
    expect(at("mix").resource).toEqual({ kind: "mixer", id: 1, name: "Spiral mixer" });
    expect(at("shape").resource?.kind).toBe("crew");
    expect(at("bake").resource).toEqual({ kind: "oven", id: 1, name: "Deck oven" });
    expect(at("proof").resource).toBeNull();
    expect(s.mixes).toEqual([expect.objectContaining({ formulaId: 1, index: 1, mixerName: "Spiral mixer", startsAt: at("mix").startsAt, pasteStartsAt: at("paste").startsAt, pans: [{ productId: 1, pans: 10 }] })]);
    expect(s.conflicts).toEqual([]);
    expect(check(input(), s)).toEqual([]);
  });

  it("writes instants in the bakery's zone exactly as luxon does, across the spring DST change", () => {
    // 8 Mar 2026: US clocks go from 02:00 CST to 03:00 CDT (Energy Policy Act of 2005 rules).
    const s = scheduleDay(input({ date: "2026-03-08" }));
    for (const e of s.entries) {
      expect(e.startsAt).toBe(DateTime.fromISO(e.startsAt, { setZone: true }).setZone("America/Chicago").toISO());
    }
    expect(s.dispatchAt).toBe("2026-03-08T06:30:00.000-05:00");
    const paste = s.entries.find((e) => e.step === "paste")!;
    // The same 5 h 53 min of work before 06:30 starts an hour earlier on the clock, in CST.
    expect(paste.startsAt).toBe("2026-03-07T23:37:00.000-06:00");
  });
});

describe("every weigh-out card is one mix on one mixer", () => {
  const two = input({ products: [product({ productId: 1, pans: 20 })], mixes: [{ formulaId: 1, index: 1, doughGrams: 10255 }, { formulaId: 1, index: 2, doughGrams: 10255 }] });

  it("one mixer: the second mix waits for the first, and each card has its own mix step and paste", () => {
    const s = scheduleDay(two);
    const mixes = s.entries.filter((e) => e.step === "mix");
    expect(mixes.map((m) => m.mix).sort()).toEqual([1, 2]);
    const pastes = s.entries.filter((e) => e.step === "paste");
    expect(pastes.map((p) => p.mix).sort()).toEqual([1, 2]);
    const [a, b] = [...mixes].sort((x, y) => Date.parse(x.startsAt) - Date.parse(y.startsAt));
    expect(Date.parse(b.startsAt)).toBeGreaterThanOrEqual(Date.parse(a.endsAt));
    // Mix 1 makes the earlier pans: its mix comes first.
    expect(a.mix).toBe(1);
    expect(s.mixes.map((m) => m.pans.reduce((n, p) => n + p.pans, 0))).toEqual([10, 10]);
    expect(check(two, s)).toEqual([]);
  });

  it("two mixers: a mix goes only on a mixer that holds it", () => {
    const i = { ...two, resources: resources({ mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 20 }, { id: 2, name: "Small planetary", capacityKg: 8 }] }) };
    const s = scheduleDay(i);
    for (const m of s.entries.filter((e) => e.step === "mix")) expect(m.resource?.name).toBe("Spiral mixer");
    // Two ovens bake both loads at once, so both mixes are wanted at the same time: the second mixer takes one.
    const roomy = { ...i, resources: resources({ mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 20 }, { id: 2, name: "Second spiral", capacityKg: 12 }], ovens: [deck(), deck({ id: 3, name: "Second deck" })], crew: { people: 6, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 } }) };
    const s2 = scheduleDay(roomy);
    expect(new Set(s2.entries.filter((e) => e.step === "mix").map((m) => m.resource?.name))).toEqual(new Set(["Spiral mixer", "Second spiral"]));
    expect(check(roomy, s2)).toEqual([]);
  });

  it("a formula without a mix step still gets one per card, and says so", () => {
    const i = input({ formulas: [{ id: 1, name: "Milk bread", steps: ROLL_STEPS.filter((s) => s.kind !== "mix"), retardHours: null }] });
    const s = scheduleDay(i);
    expect(s.entries.filter((e) => e.step === "mix")).toHaveLength(1);
    expect(s.warnings).toEqual([expect.stringMatching(/no mix step: 15 min of mixing is assumed/)]);
    expect(check(i, s)).toEqual([]);
  });
});

describe("oven loads: space, temperature, bake time", () => {
  it("counts shelf area, not pans: a half sheet and a 9×13 pan share 3,000 cm², two half sheets do not", () => {
    // 457 × 330 mm = 1,508.1 cm²; 330 × 229 mm = 755.7 cm².
    expect(panAreaCm2(457, 330)).toBeCloseTo(1508.1, 1);
    const oven = deck({ capacity: { kind: "area", areaCm2: 3000 } });
    const i = input({
      resources: resources({ ovens: [oven] }),
      products: [product({ productId: 1, pans: 1 }), product({ productId: 2, pans: 3, ...HALF_SHEET, pieces: 72, pieceGrams: 45 })],
    });
    const s = scheduleDay(i);
    for (const l of s.ovenLoads) expect(l.usedAreaCm2).toBeLessThanOrEqual(3000);
    expect(s.ovenLoads.map((l) => l.pans).reduce((a, b) => a + b, 0)).toBe(4);
    expect(check(i, s)).toEqual([]);
  });

  it("bakes each product at its own time and temperature: small buns and a lidded loaf never share a load", () => {
    const i = input({
      resources: resources({ ovens: [deck(), convection()] }),
      products: [
        product({ productId: 1, pans: 4, ...HALF_SHEET, pieces: 96, pieceGrams: 45, bakeMinutes: 16 }),
        product({ productId: 2, pans: 3, ...PULLMAN, pieces: 3, pieceGrams: 900, bakeMinutes: 40, coolMinutes: 90 }),
        product({ productId: 3, formulaId: 3, pans: 2, ...HALF_SHEET, pieces: 32, pieceGrams: 90 }),
      ],
      mixes: [{ formulaId: 1, index: 1, doughGrams: 7200 }, { formulaId: 3, index: 1, doughGrams: 3000 }],
    });
    const s = scheduleDay(i);
    for (const l of s.ovenLoads) {
      const ids = new Set(l.items.map((x) => x.productId));
      if (ids.has(2)) expect([...ids]).toEqual([2]);
    }
    const loafLoad = s.ovenLoads.find((l) => l.items.some((x) => x.productId === 2))!;
    expect(loafLoad.bakeMinutes).toBe(40);
    const briocheLoad = s.ovenLoads.find((l) => l.items.some((x) => x.productId === 3))!;
    expect([briocheLoad.bakeMinutes, briocheLoad.temperatureC]).toEqual([16, 190]); // from the brioche formula
    // The loaf cools 90 min, so it comes out at least 90 min before packing.
    expect(Date.parse(s.packFrom) - Date.parse(loafLoad.endsAt)).toBeGreaterThanOrEqual(90 * 60_000);
    expect(check(i, s)).toEqual([]);
  });

  it("puts pans only in named slots they fit, and names the slots", () => {
    const i = input({
      resources: resources({ ovens: [convection({ capacity: { kind: "slots", slots: ["Top", "Middle", "Bottom"], slotLengthMm: 460, slotWidthMm: 335 } })] }),
      products: [product({ productId: 1, pans: 4, ...HALF_SHEET, pieces: 96, pieceGrams: 45 })],
    });
    const s = scheduleDay(i);
    expect(s.ovenLoads.map((l) => l.pans)).toEqual([1, 3]);
    expect(s.ovenLoads[1].items[0].slots).toEqual(["Top", "Middle", "Bottom"]);
    expect(check(i, s)).toEqual([]);
  });

  it("says so when a pan fits no oven", () => {
    const i = input({
      resources: resources({ ovens: [convection({ capacity: { kind: "slots", slots: ["Shelf"], slotLengthMm: 400, slotWidthMm: 300 } })] }),
      products: [product({ productId: 1, name: "Sheet focaccia", pans: 2, ...HALF_SHEET })],
    });
    const s = scheduleDay(i);
    expect(s.ovenLoads).toEqual([]);
    expect(s.conflicts).toEqual([expect.objectContaining({ kind: "no_oven", message: expect.stringMatching(/^Sheet focaccia: its pan \(457 × 330 mm\) fits no oven, so its 2 pans are not scheduled/) })]);
    expect(s.entries.filter((e) => e.step === "mix")).toHaveLength(1); // the card still has its mix
  });

  it("leaves the oven its temperature-change time between loads at different temperatures", () => {
    const i = input({
      products: [product({ productId: 1, pans: 12 }), product({ productId: 3, formulaId: 3, pans: 6, ...HALF_SHEET, pieces: 96, pieceGrams: 90 })],
      mixes: [{ formulaId: 1, index: 1, doughGrams: 12300 }, { formulaId: 3, index: 1, doughGrams: 8900 }],
    });
    const s = scheduleDay(i);
    const loads = s.ovenLoads;
    const heats = s.entries.filter((e) => e.step === "heat");
    let changes = 0;
    for (let k = 1; k < loads.length; k++) {
      if (loads[k].temperatureC === loads[k - 1].temperatureC) continue;
      changes++;
      const gap = Date.parse(loads[k].startsAt) - Date.parse(loads[k - 1].endsAt);
      expect(gap).toBeGreaterThanOrEqual(20 * 60_000);
      expect(heats.some((h) => Date.parse(h.startsAt) >= Date.parse(loads[k - 1].endsAt) && Date.parse(h.endsAt) <= Date.parse(loads[k].startsAt) && h.temperatureC === loads[k].temperatureC)).toBe(true);
    }
    expect(changes).toBeGreaterThan(0);
    expect(heats).toHaveLength(changes);
    expect(check(i, s)).toEqual([]);
  });
});

describe("the crew", () => {
  it("shapes one portion at a time; with more people each takes less time", () => {
    const i = input({ products: [product({ productId: 1, pans: 24 })], mixes: [{ formulaId: 1, index: 1, doughGrams: 12300 }, { formulaId: 1, index: 2, doughGrams: 12300 }] });
    const one = scheduleDay(i);
    const three = scheduleDay({ ...i, resources: resources({ crew: { people: 3, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 } }) });
    const minutes = (s: ReturnType<typeof scheduleDay>) => s.entries.filter((e) => e.step === "shape").reduce((a, e) => a + (Date.parse(e.endsAt) - Date.parse(e.startsAt)) / 60_000, 0);
    // 360 pieces × 0.2 + 24 pans × 0.5 = 84 person-minutes (each portion rounded up to whole minutes).
    expect(minutes(one)).toBeGreaterThanOrEqual(84);
    expect(minutes(one)).toBeLessThanOrEqual(84 + one.entries.filter((e) => e.step === "shape").length);
    expect(minutes(three)).toBeLessThan(minutes(one) / 2);
    expect(check(i, one)).toEqual([]);
  });

  it("when the crew is busy, the step moves earlier and the rest after it says it runs longer", () => {
    const i = input({ products: [product({ productId: 1, pans: 24 })], mixes: [{ formulaId: 1, index: 1, doughGrams: 12300 }, { formulaId: 1, index: 2, doughGrams: 12300 }] });
    const s = scheduleDay(i);
    const noted = s.entries.filter((e) => e.note && /longer than the formula's/.test(e.note));
    expect(noted.length).toBeGreaterThan(0);
    for (const e of noted) expect(["proof", "bench", "bulk"]).toContain(e.step);
  });
});

describe("a day that does not fit the shift", () => {
  it("names the step, by how much, and offers the start that fits", () => {
    // The worked day above starts with the paste at 00:37: a shift from 01:17 is 40 min short.
    const s = scheduleDay(input({ resources: resources({ shiftStart: "01:17" }) }));
    expect(s.conflicts).toHaveLength(1);
    expect(s.conflicts[0]).toMatchObject({ kind: "shift_start", minutes: 40, entryId: "f1-m1-paste" });
    expect(s.conflicts[0].message).toBe("The day does not fit the shift: Cook and cool the paste (Milk bread, mix 1) has to start at 12:37 AM, 40 min before the shift starts at 1:17 AM. Start 40 min earlier, at 12:37 AM."); // times in the bakery's locale, en-US (CLDR "h:mm a")
    expect(s.earlierStart).toEqual({ minutes: 40, startsAt: "2026-06-11T00:37:00.000-05:00", text: "Start 40 min earlier, at 12:37 AM." });
    // The same day for an en-GB bakery: 24-hour times (CLDR en_GB; ICU leaves a numeric hour unpadded).
    expect(scheduleDay(input({ locale: "en-GB", resources: resources({ shiftStart: "01:17" }) })).earlierStart?.text).toBe("Start 40 min earlier, at 0:37.");
    // A shift from 00:37 fits exactly.
    expect(scheduleDay(input({ resources: resources({ shiftStart: "00:37" }) })).conflicts).toEqual([]);
  });

  it("takes a shift start later than dispatch as the evening before, and names the day", () => {
    const s = scheduleDay(input({ resources: resources({ shiftStart: "23:00" }) }));
    expect(s.shiftStartsAt).toBe("2026-06-10T23:00:00.000-05:00");
    expect(s.conflicts).toEqual([]);
    const big = scheduleDay(input({ products: [product({ productId: 1, pans: 60 })], mixes: [1, 2, 3].map((index) => ({ formulaId: 1, index, doughGrams: 20500 })), resources: resources({ shiftStart: "23:00" }) }));
    expect(big.earlierStart?.text).toMatch(/^Start (\d+ h )?\d+ min earlier, at Wed \d{1,2}:\d\d [AP]M\.$|^Start \d+ h earlier, at Wed \d{1,2}:\d\d [AP]M\.$/);
  });

  it("writes minutes as a baker reads them", () => {
    expect([minutesText(40), minutesText(60), minutesText(100), minutesText(125)]).toEqual(["40 min", "1 h", "1 h 40 min", "2 h 5 min"]);
  });
});

describe("overnight cold retard (common practice, no source: shaped rolls at about 2–4 °C for 8–16 h)", () => {
  const retarded = input({ formulas: [{ id: 1, name: "Milk bread", steps: ROLL_STEPS, retardHours: 12 }], resources: resources({ shiftStart: "03:00" }) });

  it("mixes and shapes the day before, retards the shaped pans, proofs and bakes from the retarder", () => {
    const s = scheduleDay(retarded);
    const at = (step: string) => s.entries.find((e) => e.step === step)!;
    const retard = at("retard");
    expect(Date.parse(retard.endsAt) - Date.parse(retard.startsAt)).toBe(12 * 3600_000);
    expect(retard.endsAt).toBe(at("proof").startsAt);
    expect(at("shape").endsAt).toBe(retard.startsAt);
    for (const step of ["paste", "mix", "bulk", "divide", "bench", "shape"]) expect(at(step).dayBefore).toBe(true);
    for (const step of ["retard", "proof", "wash", "bake", "cool"]) expect(at(step).dayBefore).toBe(false);
    expect(at("mix").startsAt.slice(0, 10)).toBe("2026-06-10");
    expect(at("bake").startsAt.slice(0, 10)).toBe("2026-06-11");
    expect(s.mixes[0].dayBefore).toBe(true);
    // The same-day work starts at the proof (03:40), after the 03:00 shift start: no conflict.
    expect(hm(s.startsAt!)).toBe("03:40");
    expect(s.conflicts).toEqual([]);
    expect(check(retarded, s)).toEqual([]);
  });

  it("the same dough on a same-day schedule would not fit a 03:00 shift", () => {
    const s = scheduleDay({ ...retarded, formulas: [{ id: 1, name: "Milk bread", steps: ROLL_STEPS, retardHours: null }] });
    expect(s.conflicts[0]).toMatchObject({ kind: "shift_start", minutes: 143 }); // 03:00 − 00:37
  });
});

/** A small deterministic generator (mulberry32), so the heavy day is the same on every run. */
function rng(seed: number) {
  let a = seed;
  return () => {
    a |= 0;
    a = (a + 0x6d2b79f5) | 0;
    let x = Math.imul(a ^ (a >>> 15), 1 | a);
    x = (x + Math.imul(x ^ (x >>> 7), 61 | x)) ^ x;
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
}

describe("a generated heavy day", () => {
  it.each([1, 2, 3, 4, 5])("seed %i: no overlaps on any mixer, oven or the crew; every card one mix; every load fits; all done before packing", (seed) => {
    const r = rng(seed);
    const pans = [NINE_BY_THIRTEEN, HALF_SHEET, PULLMAN];
    const products: ScheduleProduct[] = Array.from({ length: 8 }, (_, k) => {
      const pan = pans[k % 3];
      const n = 5 + Math.floor(r() * 60);
      const loaf = pan === PULLMAN;
      return product({
        productId: k + 1, formulaId: k % 2 ? 3 : 1, pans: n, ...pan, pieces: n * (loaf ? 1 : 12), pieceGrams: loaf ? 900 : 60,
        bakeMinutes: loaf ? 40 : r() < 0.5 ? 16 : null, coolMinutes: loaf ? 90 : null,
      });
    });
    const mixes = [1, 3].flatMap((fid) => {
      const grams = products.filter((p) => p.formulaId === fid).reduce((s, p) => s + p.pieces * p.pieceGrams, 0) / 0.98;
      const n = Math.ceil(grams / 20000);
      return Array.from({ length: n }, (_, j) => ({ formulaId: fid, index: j + 1, doughGrams: grams / n }));
    });
    const i = input({
      products, mixes,
      formulas: [{ id: 1, name: "Milk bread", steps: ROLL_STEPS, retardHours: seed % 2 ? 10 : null }, { id: 3, name: "Brioche", steps: BRIOCHE_STEPS, retardHours: null }],
      resources: resources({
        mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 20 }, { id: 2, name: "Second spiral", capacityKg: 20 }],
        ovens: [deck(), convection(), deck({ id: 3, name: "Rack oven", capacity: { kind: "area", areaCm2: 16000 }, tempChangeMinutes: 30 })],
        crew: { people: 4, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
        packingMinutes: 45,
        shiftStart: "22:00",
      }),
    });
    const s = scheduleDay(i);
    expect(check(i, s)).toEqual([]);
    expect(s.ovenLoads.length).toBeGreaterThan(10);
    // Grouped, not per pan: the timeline grows with loads and mixes.
    const totalPans = products.reduce((a, p) => a + p.pans, 0);
    expect(s.entries.length).toBeLessThan(8 * (s.ovenLoads.length + mixes.length) + 20);
    expect(s.entries.length).toBeLessThan(totalPans * 2);
    // Either the day fits the shift or the plan says what does not.
    const first = Math.min(...s.entries.filter((e) => !e.dayBefore && e.step !== "retard").map((e) => Date.parse(e.startsAt)));
    if (first < Date.parse(s.shiftStartsAt)) expect(s.conflicts[0]).toMatchObject({ kind: "shift_start", minutes: (Date.parse(s.shiftStartsAt) - first) / 60_000 });
    else expect(s.conflicts).toEqual([]);
  });
});
