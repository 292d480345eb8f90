import { MigrationInterface, QueryRunner } from "typeorm";

/** The bakery's locale (BCP 47): every date, time, number and amount for a person is written in it (shared/format.ts). */
export class BakeryLocale1796190000009 implements MigrationInterface {
    name = 'BakeryLocale1796190000009'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`locale\` varchar(35) NOT NULL DEFAULT 'en-US'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`locale\``);
    }
}
