import { MigrationInterface, QueryRunner } from "typeorm";
import { suggestPlural } from "../../../shared/quantity";

/**
 * A plural beside each sale unit ("tray of 15 rolls" / "trays of 15 rolls"), on the product and on the order line's
 * snapshot, so a count reads "3 trays of 15 rolls". Existing rows get the plural shared/quantity.ts suggests; the
 * owner can change a product's afterwards.
 */
export class SaleUnitPlural1796190000008 implements MigrationInterface {
    name = 'SaleUnitPlural1796190000008'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`saleUnitPlural\` varchar(60) NOT NULL DEFAULT ''`);
        await queryRunner.query(`ALTER TABLE \`order_line\` ADD \`saleUnitPlural\` varchar(60) NOT NULL DEFAULT ''`);
        for (const table of ["product", "order_line"]) {
            // Compared as bytes: "Loaf" and "loaf" are different units to the owner, one to the default collation.
            const units: { saleUnit: string }[] = await queryRunner.query(`SELECT \`saleUnit\` FROM \`${table}\` WHERE \`saleUnitPlural\` = '' GROUP BY BINARY \`saleUnit\``);
            for (const { saleUnit } of units) {
                await queryRunner.query(`UPDATE \`${table}\` SET \`saleUnitPlural\` = ? WHERE BINARY \`saleUnit\` = ? AND \`saleUnitPlural\` = ''`, [suggestPlural(saleUnit).slice(0, 60), saleUnit]);
            }
        }
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`order_line\` DROP COLUMN \`saleUnitPlural\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`saleUnitPlural\``);
    }
}
