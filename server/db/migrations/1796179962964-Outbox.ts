import { MigrationInterface, QueryRunner } from "typeorm";

export class Outbox1796179962964 implements MigrationInterface {
    name = 'Outbox1796179962964'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`mail_outbox\` (\`id\` int NOT NULL AUTO_INCREMENT, \`messageId\` varchar(190) NOT NULL, \`kind\` varchar(40) NOT NULL, \`toAddress\` varchar(254) NOT NULL, \`fromName\` varchar(160) NOT NULL, \`subject\` varchar(300) NOT NULL, \`html\` mediumtext NOT NULL, \`text\` mediumtext NOT NULL, \`attachments\` longtext NULL, \`status\` varchar(10) NOT NULL DEFAULT 'pending', \`attempts\` int NOT NULL DEFAULT '0', \`nextAttemptAt\` datetime(3) NOT NULL, \`lastError\` varchar(500) NULL, \`sentAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_55254ba56de5383cf318de2ff3\` (\`messageId\`), INDEX \`IDX_4537a362b5e891c5aba08e0c31\` (\`status\`, \`nextAttemptAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX \`IDX_4537a362b5e891c5aba08e0c31\` ON \`mail_outbox\``);
        await queryRunner.query(`DROP INDEX \`IDX_55254ba56de5383cf318de2ff3\` ON \`mail_outbox\``);
        await queryRunner.query(`DROP TABLE \`mail_outbox\``);
    }

}
