import { MigrationInterface, QueryRunner } from "typeorm";

export class Foundation1796177540539 implements MigrationInterface {
    name = 'Foundation1796177540539'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`bakery\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(160) NOT NULL, \`timeZone\` varchar(64) NOT NULL DEFAULT 'America/Chicago', \`currency\` char(3) NOT NULL DEFAULT 'USD', \`email\` varchar(254) NOT NULL DEFAULT '', \`phone\` varchar(40) NOT NULL DEFAULT '', \`address\` varchar(500) NOT NULL DEFAULT '', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`customer_account\` (\`id\` int NOT NULL AUTO_INCREMENT, \`businessName\` varchar(160) NOT NULL, \`deliveryAddress\` varchar(500) NOT NULL, \`contactName\` varchar(120) NOT NULL DEFAULT '', \`contactPhone\` varchar(40) NOT NULL DEFAULT '', \`billingEmail\` varchar(254) NOT NULL, \`status\` varchar(16) NOT NULL DEFAULT 'active', \`notes\` text NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_c986831552865d1622bd91d003\` (\`businessName\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`user\` (\`id\` int NOT NULL AUTO_INCREMENT, \`email\` varchar(254) NOT NULL, \`passwordHash\` varchar(100) NOT NULL, \`role\` varchar(16) NOT NULL, \`name\` varchar(120) NOT NULL, \`accountId\` int NULL, \`disabled\` tinyint NOT NULL DEFAULT 0, \`lastSignInAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` (\`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`auth_token\` (\`id\` int NOT NULL AUTO_INCREMENT, \`kind\` varchar(20) NOT NULL, \`tokenHash\` char(64) NOT NULL, \`email\` varchar(254) NOT NULL, \`userId\` int NULL, \`role\` varchar(16) NULL, \`accountId\` int NULL, \`name\` varchar(120) NULL, \`createdById\` int NULL, \`expiresAt\` datetime(3) NOT NULL, \`usedAt\` datetime(3) NULL, \`revokedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_7634f50cfa7ac8e4e4d5f31e35\` (\`tokenHash\`), INDEX \`IDX_5cf58d6dcef09d81b294f75012\` (\`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`sign_in_failure\` (\`id\` bigint NOT NULL AUTO_INCREMENT, \`email\` varchar(254) NOT NULL, \`ip\` varchar(64) NOT NULL, \`at\` datetime(3) NOT NULL, INDEX \`IDX_903cb2e37d0274d3581845c137\` (\`ip\`, \`at\`), INDEX \`IDX_1977f76c7f17cc82bb9aa4a187\` (\`email\`, \`at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`user\` ADD CONSTRAINT \`FK_68d3c22dbd95449360fdbf7a3f1\` FOREIGN KEY (\`accountId\`) REFERENCES \`customer_account\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`user\` DROP FOREIGN KEY \`FK_68d3c22dbd95449360fdbf7a3f1\``);
        await queryRunner.query(`DROP INDEX \`IDX_1977f76c7f17cc82bb9aa4a187\` ON \`sign_in_failure\``);
        await queryRunner.query(`DROP INDEX \`IDX_903cb2e37d0274d3581845c137\` ON \`sign_in_failure\``);
        await queryRunner.query(`DROP TABLE \`sign_in_failure\``);
        await queryRunner.query(`DROP INDEX \`IDX_5cf58d6dcef09d81b294f75012\` ON \`auth_token\``);
        await queryRunner.query(`DROP INDEX \`IDX_7634f50cfa7ac8e4e4d5f31e35\` ON \`auth_token\``);
        await queryRunner.query(`DROP TABLE \`auth_token\``);
        await queryRunner.query(`DROP INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` ON \`user\``);
        await queryRunner.query(`DROP TABLE \`user\``);
        await queryRunner.query(`DROP INDEX \`IDX_c986831552865d1622bd91d003\` ON \`customer_account\``);
        await queryRunner.query(`DROP TABLE \`customer_account\``);
        await queryRunner.query(`DROP TABLE \`bakery\``);
    }

}
