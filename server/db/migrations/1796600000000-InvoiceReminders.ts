import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Payment reminders: one row per reminder e-mail queued for an invoice (by hand or by the schedule), and the
 * bakery's switch for the schedule (3 days before the due date, on it, and 7 days after).
 */
export class InvoiceReminders1796600000000 implements MigrationInterface {
    name = 'InvoiceReminders1796600000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`invoice_reminder\` (\`id\` int NOT NULL AUTO_INCREMENT, \`invoiceId\` int NOT NULL, \`stage\` varchar(12) NOT NULL, \`sentById\` int NULL, \`outboxMailId\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`remindersOn\` tinyint NOT NULL DEFAULT 0`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`remindersOn\``);
        await queryRunner.query(`DROP TABLE \`invoice_reminder\``);
    }
}
