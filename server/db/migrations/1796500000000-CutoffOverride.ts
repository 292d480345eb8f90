import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * An order the owner took or changed past its cut-off (a phone order): who confirmed it, when, and why, kept on
 * the order itself so the bake day and the books can see it was late by the owner's decision.
 */
export class CutoffOverride1796500000000 implements MigrationInterface {
    name = 'CutoffOverride1796500000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`customer_order\` ADD \`cutoffOverrideById\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`customer_order\` ADD \`cutoffOverrideAt\` datetime(3) NULL`);
        await queryRunner.query(`ALTER TABLE \`customer_order\` ADD \`cutoffOverrideReason\` varchar(200) NULL`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`customer_order\` DROP COLUMN \`cutoffOverrideReason\``);
        await queryRunner.query(`ALTER TABLE \`customer_order\` DROP COLUMN \`cutoffOverrideAt\``);
        await queryRunner.query(`ALTER TABLE \`customer_order\` DROP COLUMN \`cutoffOverrideById\``);
    }
}
