import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Bakehouse resources for the one schedule of the bake day: mixers (capacity each), ovens (usable shelf area or
 * named pan slots, temperature-change, load and unload minutes), and the production settings row (crew and its
 * person-minutes, packing minutes, shift start, doughs retarded overnight). The bakery's old single mixer size,
 * oven count and pans per load move into them: each old oven becomes a slot oven with that many half-sheet-sized
 * slots (460 × 335 mm), so an existing bakery keeps the capacity it had.
 */
export class BakehouseResources1796190000006 implements MigrationInterface {
    name = 'BakehouseResources1796190000006'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`production_settings\` (\`id\` int NOT NULL, \`crewPeople\` int NOT NULL, \`divideMinutesPerPiece\` decimal(6,3) NOT NULL, \`shapeMinutesPerPiece\` decimal(6,3) NOT NULL, \`panMinutesPerPan\` decimal(6,3) NOT NULL, \`packingMinutes\` int NOT NULL, \`shiftStart\` char(5) NULL, \`retard\` text NOT NULL, \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`bakehouse_mixer\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(60) NOT NULL, \`capacityKg\` decimal(6,2) NOT NULL, \`sortOrder\` int NOT NULL DEFAULT '0', PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`bakehouse_oven\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(60) NOT NULL, \`capacityKind\` varchar(8) NOT NULL, \`areaCm2\` int NULL, \`slotNames\` text NOT NULL, \`slotLengthMm\` int NULL, \`slotWidthMm\` int NULL, \`tempChangeMinutes\` int NOT NULL, \`loadMinutes\` int NOT NULL, \`unloadMinutes\` int NOT NULL, \`sortOrder\` int NOT NULL DEFAULT '0', PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        // Carry an existing bakery's settings forward (a fresh database has no bakery yet: the code's defaults or the seed apply).
        const rows: { mixerCapacityKg: string; ovens: number; pansPerLoad: number }[] = await queryRunner.query(`SELECT \`mixerCapacityKg\`, \`ovens\`, \`pansPerLoad\` FROM \`bakery\` ORDER BY \`id\` LIMIT 1`);
        if (rows.length) {
            const b = rows[0];
            await queryRunner.query(`INSERT INTO \`production_settings\` (\`id\`, \`crewPeople\`, \`divideMinutesPerPiece\`, \`shapeMinutesPerPiece\`, \`panMinutesPerPan\`, \`packingMinutes\`, \`shiftStart\`, \`retard\`) VALUES (1, 2, 0.15, 0.2, 0.5, 30, NULL, '[]')`);
            await queryRunner.query(`INSERT INTO \`bakehouse_mixer\` (\`name\`, \`capacityKg\`, \`sortOrder\`) VALUES ('Mixer', ?, 0)`, [b.mixerCapacityKg]);
            const slots = JSON.stringify(Array.from({ length: Number(b.pansPerLoad) }, (_, i) => `Slot ${i + 1}`));
            for (let i = 0; i < Number(b.ovens); i++) {
                await queryRunner.query(`INSERT INTO \`bakehouse_oven\` (\`name\`, \`capacityKind\`, \`areaCm2\`, \`slotNames\`, \`slotLengthMm\`, \`slotWidthMm\`, \`tempChangeMinutes\`, \`loadMinutes\`, \`unloadMinutes\`, \`sortOrder\`) VALUES (?, 'slots', NULL, ?, 460, 335, 15, 2, 2, ?)`, [Number(b.ovens) > 1 ? `Oven ${i + 1}` : "Oven", slots, i]);
            }
        }
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`pansPerLoad\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`ovens\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`mixerCapacityKg\``);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`mixerCapacityKg\` decimal(6,2) NOT NULL DEFAULT '20.00'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`ovens\` int NOT NULL DEFAULT '1'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`pansPerLoad\` int NOT NULL DEFAULT '6'`);
        // Best effort back: the largest mixer, the number of ovens, the first oven's slots (or 6).
        await queryRunner.query(`UPDATE \`bakery\` SET \`mixerCapacityKg\` = COALESCE((SELECT MAX(\`capacityKg\`) FROM \`bakehouse_mixer\`), 20), \`ovens\` = GREATEST(1, (SELECT COUNT(*) FROM \`bakehouse_oven\`))`);
        await queryRunner.query(`DROP TABLE \`bakehouse_oven\``);
        await queryRunner.query(`DROP TABLE \`bakehouse_mixer\``);
        await queryRunner.query(`DROP TABLE \`production_settings\``);
    }

}
