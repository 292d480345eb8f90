import { MigrationInterface, QueryRunner } from "typeorm";

export class Billing1796180050123 implements MigrationInterface {
    name = 'Billing1796180050123'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`number_counter\` (\`series\` varchar(20) NOT NULL, \`year\` int NOT NULL, \`next\` int NOT NULL, PRIMARY KEY (\`series\`, \`year\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`invoice\` (\`id\` int NOT NULL AUTO_INCREMENT, \`number\` varchar(30) NOT NULL, \`year\` int NOT NULL, \`seq\` int NOT NULL, \`accountId\` int NOT NULL, \`kind\` varchar(10) NOT NULL, \`status\` varchar(20) NOT NULL DEFAULT 'open', \`issueDate\` date NOT NULL, \`dueDate\` date NOT NULL, \`periodStart\` date NULL, \`periodEnd\` date NULL, \`currency\` char(3) NOT NULL, \`subtotalCents\` int NOT NULL, \`taxRateBp\` int NOT NULL, \`taxCents\` int NOT NULL, \`totalCents\` int NOT NULL, \`creditedCents\` int NOT NULL DEFAULT '0', \`paidCents\` int NOT NULL DEFAULT '0', \`refundedCents\` int NOT NULL DEFAULT '0', \`taxExempt\` tinyint NOT NULL DEFAULT 0, \`sentAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_60284980bc8b9c624459948f4a\` (\`number\`), INDEX \`IDX_030dafa5bfb99ac98f9db737d1\` (\`accountId\`, \`status\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`invoice_line\` (\`id\` int NOT NULL AUTO_INCREMENT, \`invoiceId\` int NOT NULL, \`orderLineId\` int NOT NULL, \`orderId\` int NOT NULL, \`deliveryDate\` date NOT NULL, \`description\` varchar(200) NOT NULL, \`quantity\` int NOT NULL, \`unitPriceCents\` int NOT NULL, \`amountCents\` int NOT NULL, UNIQUE INDEX \`IDX_288bbe9f81f88c9b130b6d93d4\` (\`orderLineId\`), INDEX \`IDX_d1abbe501a231d860de4e4eb59\` (\`invoiceId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`payment\` (\`id\` int NOT NULL AUTO_INCREMENT, \`invoiceId\` int NOT NULL, \`method\` varchar(20) NOT NULL, \`amountCents\` int NOT NULL, \`reference\` varchar(120) NOT NULL DEFAULT '', \`stripePaymentIntentId\` varchar(80) NULL, \`stripeChargeId\` varchar(80) NULL, \`receivedOn\` date NOT NULL, \`recordedById\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_87223c7f1d4c2ca51cf6992784\` (\`invoiceId\`), UNIQUE INDEX \`IDX_aaf4912b634282efbc202ebd4d\` (\`stripePaymentIntentId\`), INDEX \`IDX_3d338fcc10ffd8c44d599e348c\` (\`stripeChargeId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`credit_note\` (\`id\` int NOT NULL AUTO_INCREMENT, \`number\` varchar(30) NOT NULL, \`invoiceId\` int NOT NULL, \`accountId\` int NOT NULL, \`reason\` varchar(300) NOT NULL, \`lines\` text NOT NULL, \`subtotalCents\` int NOT NULL, \`taxCents\` int NOT NULL, \`totalCents\` int NOT NULL, \`disposition\` varchar(10) NOT NULL, \`carriedToInvoiceId\` int NULL, \`stripeRefundId\` varchar(80) NULL, \`issueDate\` date NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_35658bfb675c9321a4e20fa437\` (\`number\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`refund\` (\`id\` int NOT NULL AUTO_INCREMENT, \`invoiceId\` int NOT NULL, \`stripeRefundId\` varchar(80) NOT NULL, \`stripeChargeId\` varchar(80) NULL, \`amountCents\` int NOT NULL, \`creditNoteId\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_bf3ec9c4f6ab227ff200fc35d2\` (\`stripeRefundId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`checkout_session\` (\`id\` varchar(120) NOT NULL, \`invoiceId\` int NOT NULL, \`amountCents\` int NOT NULL, \`url\` varchar(500) NOT NULL, \`status\` varchar(12) NOT NULL DEFAULT 'open', \`expiresAt\` datetime(3) NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_9b4e56cf72655b30fd6be7edcf\` (\`invoiceId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`stripe_event\` (\`id\` varchar(80) NOT NULL, \`type\` varchar(60) NOT NULL, \`receivedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`payout_reconciliation\` (\`payoutId\` varchar(80) NOT NULL, \`reconciledById\` int NOT NULL, \`reconciledAt\` datetime(3) NOT NULL, \`note\` varchar(300) NOT NULL DEFAULT '', PRIMARY KEY (\`payoutId\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`tax_certificate\` (\`id\` int NOT NULL AUTO_INCREMENT, \`accountId\` int NOT NULL, \`file\` varchar(80) NOT NULL, \`contentType\` varchar(40) NOT NULL, \`status\` varchar(10) NOT NULL DEFAULT 'pending', \`expiresOn\` date NOT NULL, \`reviewedById\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_18cfeabe4955edbd51098fe78d\` (\`accountId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`delivery_adjustment\` (\`id\` int NOT NULL AUTO_INCREMENT, \`orderId\` int NOT NULL, \`productId\` int NOT NULL, \`deliveredQuantity\` int NOT NULL, \`reason\` varchar(200) NOT NULL DEFAULT '', \`creditNoteId\` int NULL, UNIQUE INDEX \`IDX_8b2424a3b28b18ae6aeb081c20\` (\`orderId\`, \`productId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`salesTaxRateBp\` int NOT NULL DEFAULT '0'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`invoicePrefix\` varchar(8) NOT NULL DEFAULT 'INV'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`creditHoldDays\` int NOT NULL DEFAULT '14'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`paymentInstructions\` varchar(600) NOT NULL DEFAULT ''`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`paymentTerms\` varchar(6) NOT NULL DEFAULT 'card'`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`creditHold\` tinyint NOT NULL DEFAULT 0`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`stripeCustomerId\` varchar(80) NULL`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`stripeCustomerId\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`creditHold\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`paymentTerms\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`paymentInstructions\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`creditHoldDays\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`invoicePrefix\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`salesTaxRateBp\``);
        await queryRunner.query(`DROP INDEX \`IDX_8b2424a3b28b18ae6aeb081c20\` ON \`delivery_adjustment\``);
        await queryRunner.query(`DROP TABLE \`delivery_adjustment\``);
        await queryRunner.query(`DROP INDEX \`IDX_18cfeabe4955edbd51098fe78d\` ON \`tax_certificate\``);
        await queryRunner.query(`DROP TABLE \`tax_certificate\``);
        await queryRunner.query(`DROP TABLE \`payout_reconciliation\``);
        await queryRunner.query(`DROP TABLE \`stripe_event\``);
        await queryRunner.query(`DROP INDEX \`IDX_9b4e56cf72655b30fd6be7edcf\` ON \`checkout_session\``);
        await queryRunner.query(`DROP TABLE \`checkout_session\``);
        await queryRunner.query(`DROP INDEX \`IDX_bf3ec9c4f6ab227ff200fc35d2\` ON \`refund\``);
        await queryRunner.query(`DROP TABLE \`refund\``);
        await queryRunner.query(`DROP INDEX \`IDX_35658bfb675c9321a4e20fa437\` ON \`credit_note\``);
        await queryRunner.query(`DROP TABLE \`credit_note\``);
        await queryRunner.query(`DROP INDEX \`IDX_3d338fcc10ffd8c44d599e348c\` ON \`payment\``);
        await queryRunner.query(`DROP INDEX \`IDX_aaf4912b634282efbc202ebd4d\` ON \`payment\``);
        await queryRunner.query(`DROP INDEX \`IDX_87223c7f1d4c2ca51cf6992784\` ON \`payment\``);
        await queryRunner.query(`DROP TABLE \`payment\``);
        await queryRunner.query(`DROP INDEX \`IDX_d1abbe501a231d860de4e4eb59\` ON \`invoice_line\``);
        await queryRunner.query(`DROP INDEX \`IDX_288bbe9f81f88c9b130b6d93d4\` ON \`invoice_line\``);
        await queryRunner.query(`DROP TABLE \`invoice_line\``);
        await queryRunner.query(`DROP INDEX \`IDX_030dafa5bfb99ac98f9db737d1\` ON \`invoice\``);
        await queryRunner.query(`DROP INDEX \`IDX_60284980bc8b9c624459948f4a\` ON \`invoice\``);
        await queryRunner.query(`DROP TABLE \`invoice\``);
        await queryRunner.query(`DROP TABLE \`number_counter\``);
    }

}
