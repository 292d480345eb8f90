import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Foreign keys for the billing tables (generated from the entities). Money rows refuse to lose what they point at
 * (ON DELETE RESTRICT); only an invoice's lines (CASCADE from invoice) and a delivery adjustment (CASCADE from its
 * order) cannot outlive their parent. Panwise never deletes accounts, users, orders, invoices or credit notes, and
 * every id these columns hold was written from a row that existed, so existing rows satisfy the keys.
 */
export class BillingForeignKeys1796278267140 implements MigrationInterface {
    name = 'BillingForeignKeys1796278267140'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`invoice\` ADD CONSTRAINT \`FK_89cf170c6771515b780b428338b\` FOREIGN KEY (\`accountId\`) REFERENCES \`customer_account\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`checkout_session\` ADD CONSTRAINT \`FK_9b4e56cf72655b30fd6be7edcf1\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`credit_note\` ADD CONSTRAINT \`FK_76bc78748c7e6bcfbfb47857c72\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`credit_note\` ADD CONSTRAINT \`FK_797b701005643224f9d19bf5bd5\` FOREIGN KEY (\`accountId\`) REFERENCES \`customer_account\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`credit_note\` ADD CONSTRAINT \`FK_180f8ed7d45a09685c5b764348a\` FOREIGN KEY (\`carriedToInvoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` ADD CONSTRAINT \`FK_a97c57bd7516b8ae4287a641904\` FOREIGN KEY (\`orderId\`) REFERENCES \`customer_order\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` ADD CONSTRAINT \`FK_cbb3ce6b7cc49f1b0e4f43572c9\` FOREIGN KEY (\`productId\`) REFERENCES \`product\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` ADD CONSTRAINT \`FK_53b6ce90421ecf8e899da33453a\` FOREIGN KEY (\`creditNoteId\`) REFERENCES \`credit_note\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` ADD CONSTRAINT \`FK_d1abbe501a231d860de4e4eb597\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` ADD CONSTRAINT \`FK_288bbe9f81f88c9b130b6d93d4a\` FOREIGN KEY (\`orderLineId\`) REFERENCES \`order_line\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` ADD CONSTRAINT \`FK_f39f2349636fb2264813f5c3528\` FOREIGN KEY (\`orderId\`) REFERENCES \`customer_order\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`payment\` ADD CONSTRAINT \`FK_87223c7f1d4c2ca51cf69927844\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`payment\` ADD CONSTRAINT \`FK_3f13c738eff604a85700746ec7d\` FOREIGN KEY (\`recordedById\`) REFERENCES \`user\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`payout_reconciliation\` ADD CONSTRAINT \`FK_9d79ad50e4577737c962349f752\` FOREIGN KEY (\`reconciledById\`) REFERENCES \`user\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`refund\` ADD CONSTRAINT \`FK_da53b856e22ce3acebf1c040c27\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`refund\` ADD CONSTRAINT \`FK_5bbb5e68d47525fb82cbab2e691\` FOREIGN KEY (\`creditNoteId\`) REFERENCES \`credit_note\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` ADD CONSTRAINT \`FK_5f11cd9705710fd24a4721a3cfe\` FOREIGN KEY (\`invoiceId\`) REFERENCES \`invoice\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` ADD CONSTRAINT \`FK_18cfeabe4955edbd51098fe78d6\` FOREIGN KEY (\`accountId\`) REFERENCES \`customer_account\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` ADD CONSTRAINT \`FK_99f1e1a58a7000e39db186564a4\` FOREIGN KEY (\`reviewedById\`) REFERENCES \`user\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` DROP FOREIGN KEY \`FK_99f1e1a58a7000e39db186564a4\``);
        await queryRunner.query(`ALTER TABLE \`tax_certificate\` DROP FOREIGN KEY \`FK_18cfeabe4955edbd51098fe78d6\``);
        await queryRunner.query(`ALTER TABLE \`stripe_event\` DROP FOREIGN KEY \`FK_5f11cd9705710fd24a4721a3cfe\``);
        await queryRunner.query(`ALTER TABLE \`refund\` DROP FOREIGN KEY \`FK_5bbb5e68d47525fb82cbab2e691\``);
        await queryRunner.query(`ALTER TABLE \`refund\` DROP FOREIGN KEY \`FK_da53b856e22ce3acebf1c040c27\``);
        await queryRunner.query(`ALTER TABLE \`payout_reconciliation\` DROP FOREIGN KEY \`FK_9d79ad50e4577737c962349f752\``);
        await queryRunner.query(`ALTER TABLE \`payment\` DROP FOREIGN KEY \`FK_3f13c738eff604a85700746ec7d\``);
        await queryRunner.query(`ALTER TABLE \`payment\` DROP FOREIGN KEY \`FK_87223c7f1d4c2ca51cf69927844\``);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` DROP FOREIGN KEY \`FK_f39f2349636fb2264813f5c3528\``);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` DROP FOREIGN KEY \`FK_288bbe9f81f88c9b130b6d93d4a\``);
        await queryRunner.query(`ALTER TABLE \`invoice_line\` DROP FOREIGN KEY \`FK_d1abbe501a231d860de4e4eb597\``);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` DROP FOREIGN KEY \`FK_53b6ce90421ecf8e899da33453a\``);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` DROP FOREIGN KEY \`FK_cbb3ce6b7cc49f1b0e4f43572c9\``);
        await queryRunner.query(`ALTER TABLE \`delivery_adjustment\` DROP FOREIGN KEY \`FK_a97c57bd7516b8ae4287a641904\``);
        await queryRunner.query(`ALTER TABLE \`credit_note\` DROP FOREIGN KEY \`FK_180f8ed7d45a09685c5b764348a\``);
        await queryRunner.query(`ALTER TABLE \`credit_note\` DROP FOREIGN KEY \`FK_797b701005643224f9d19bf5bd5\``);
        await queryRunner.query(`ALTER TABLE \`credit_note\` DROP FOREIGN KEY \`FK_76bc78748c7e6bcfbfb47857c72\``);
        await queryRunner.query(`ALTER TABLE \`checkout_session\` DROP FOREIGN KEY \`FK_9b4e56cf72655b30fd6be7edcf1\``);
        await queryRunner.query(`ALTER TABLE \`invoice\` DROP FOREIGN KEY \`FK_89cf170c6771515b780b428338b\``);
    }

}
