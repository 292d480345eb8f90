import { createTestDatabase } from "./helpers/db";

/** The BakehouseResources migration on a database made before it (moved out of production.test.ts). */
describe("migration BakehouseResources", () => {
  it("carries an existing bakery's mixer size, oven count and pans per load into the new settings (and back)", async () => {
    const db = await createTestDatabase();
    try {
      const ds = db.dataSource;
      // Step back to just before this migration (later migrations first), as on a database made before it.
      for (;;) {
        const [last]: { name: string }[] = await ds.query("SELECT name FROM migrations ORDER BY id DESC LIMIT 1");
        await ds.undoLastMigration({ transaction: "each" });
        if (last.name.startsWith("BakehouseResources")) break;
      }
      await ds.query("INSERT INTO bakery (name, mixerCapacityKg, ovens, pansPerLoad) VALUES ('Old Bakery', 35, 2, 8)");
      await ds.runMigrations({ transaction: "each" });
      expect(await ds.query("SELECT name, capacityKg FROM bakehouse_mixer")).toEqual([{ name: "Mixer", capacityKg: "35.00" }]);
      const ovens: { name: string; capacityKind: string; slotNames: string; slotLengthMm: number; slotWidthMm: number }[] = await ds.query("SELECT name, capacityKind, slotNames, slotLengthMm, slotWidthMm FROM bakehouse_oven ORDER BY sortOrder");
      expect(ovens.map((o) => [o.name, o.capacityKind, JSON.parse(o.slotNames).length, o.slotLengthMm, o.slotWidthMm])).toEqual([["Oven 1", "slots", 8, 460, 335], ["Oven 2", "slots", 8, 460, 335]]);
      expect(await ds.query("SELECT crewPeople, packingMinutes, shiftStart, retard FROM production_settings")).toEqual([{ crewPeople: 2, packingMinutes: 30, shiftStart: null, retard: "[]" }]);
    } finally {
      await db.drop();
    }
  });
});
