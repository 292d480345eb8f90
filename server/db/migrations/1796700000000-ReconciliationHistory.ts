import { MigrationInterface, QueryRunner } from "typeorm";

/** Every reconcile and every undo of a payout's reconciliation, with who, when and the note or reason. */
export class ReconciliationHistory1796700000000 implements MigrationInterface {
    name = 'ReconciliationHistory1796700000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`payout_reconciliation_event\` (\`id\` int NOT NULL AUTO_INCREMENT, \`payoutId\` varchar(80) NOT NULL, \`action\` varchar(12) NOT NULL, \`byId\` int NOT NULL, \`at\` datetime(3) NOT NULL, \`note\` varchar(300) NOT NULL DEFAULT '', PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TABLE \`payout_reconciliation_event\``);
    }
}
