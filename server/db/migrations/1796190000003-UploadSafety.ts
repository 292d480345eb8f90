import { MigrationInterface, QueryRunner } from "typeorm";

export class UploadSafety1796190000003 implements MigrationInterface {
    name = 'UploadSafety1796190000003'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` ADD \`sizeBytes\` int NOT NULL DEFAULT '0'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` DROP COLUMN \`sizeBytes\``);
    }

}
