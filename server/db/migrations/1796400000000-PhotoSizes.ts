import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * A product photo is stored three times: the checked original (private, never served), a 640 px WebP for the
 * product screens and a 160 px WebP for list tiles. `photoFile` keeps naming what the product screens show;
 * photos stored before this migration have no small size and no separate original: they are shown as they are.
 */
export class PhotoSizes1796400000000 implements MigrationInterface {
    name = 'PhotoSizes1796400000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`photoThumbFile\` varchar(80) NULL`);
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`photoOriginalFile\` varchar(80) NULL`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`photoOriginalFile\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`photoThumbFile\``);
    }
}
