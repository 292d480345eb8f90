import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Billing safety (issue 8 items 2 and 3, and the Stripe catch-up): Stripe events keep their outcome
 * (applied or rejected, with the reason and the invoice they named), where they came from and Stripe's
 * `created`; overpayment refunds are told apart from refunds of the sale; the catch-up job keeps its cursor.
 */
export class BillingSafety1796190000002 implements MigrationInterface {
    name = 'BillingSafety1796190000002'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`invoice\` ADD \`overpaymentRefundedCents\` int NOT NULL DEFAULT '0'`);
        await queryRunner.query(`ALTER TABLE \`refund\` ADD \`overpayment\` tinyint NOT NULL DEFAULT 0`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD \`outcome\` varchar(10) NOT NULL DEFAULT 'applied'`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD \`reason\` varchar(300) NOT NULL DEFAULT ''`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD \`invoiceId\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD \`source\` varchar(10) NOT NULL DEFAULT 'webhook'`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD \`stripeCreated\` int NULL`);
        await queryRunner.query(`CREATE INDEX \`IDX_281a553767b34b71886403c8c8\` ON \`stripe_event\` (\`invoiceId\`, \`outcome\`)`);
        await queryRunner.query(`CREATE TABLE \`stripe_sync_state\` (\`name\` varchar(40) NOT NULL, \`createdCursor\` int NOT NULL, \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (\`name\`)) ENGINE=InnoDB`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TABLE \`stripe_sync_state\``);
        await queryRunner.query(`DROP INDEX \`IDX_281a553767b34b71886403c8c8\` ON \`stripe_event\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP COLUMN \`stripeCreated\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP COLUMN \`source\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP COLUMN \`invoiceId\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP COLUMN \`reason\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP COLUMN \`outcome\``);
        await queryRunner.query(`ALTER TABLE \`refund\` DROP COLUMN \`overpayment\``);
        await queryRunner.query(`ALTER TABLE \`invoice\` DROP COLUMN \`overpaymentRefundedCents\``);
    }

}
