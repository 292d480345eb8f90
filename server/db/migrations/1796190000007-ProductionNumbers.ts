import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * The bake day's supply temperatures for the ice calculation: tap water (default 15 °C) and milk from the
 * cooler (default 4 °C, under the 5 °C cold-holding limit of FDA Food Code 3-501.16).
 */
export class ProductionNumbers1796190000007 implements MigrationInterface {
    name = 'ProductionNumbers1796190000007'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bake_day\` ADD \`tapC\` decimal(4,1) NOT NULL DEFAULT '15.0'`);
        await queryRunner.query(`ALTER TABLE \`bake_day\` ADD \`milkC\` decimal(4,1) NOT NULL DEFAULT '4.0'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bake_day\` DROP COLUMN \`milkC\``);
        await queryRunner.query(`ALTER TABLE \`bake_day\` DROP COLUMN \`tapC\``);
    }
}
