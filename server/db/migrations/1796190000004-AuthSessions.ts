import { MigrationInterface, QueryRunner } from "typeorm";

export class AuthSessions1796190000004 implements MigrationInterface {
    name = 'AuthSessions1796190000004'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`user\` ADD \`tokenVersion\` int NOT NULL DEFAULT '0'`);
        await queryRunner.query(`CREATE TABLE \`auth_rate_counter\` (\`scope\` varchar(24) NOT NULL, \`keyHash\` char(64) NOT NULL, \`count\` int NOT NULL DEFAULT '0', \`windowStart\` datetime(3) NOT NULL, INDEX \`IDX_auth_rate_counter_window\` (\`windowStart\`), PRIMARY KEY (\`scope\`, \`keyHash\`)) ENGINE=InnoDB`);
        await queryRunner.query(`DROP INDEX \`IDX_1977f76c7f17cc82bb9aa4a187\` ON \`sign_in_failure\``);
        await queryRunner.query(`DROP INDEX \`IDX_903cb2e37d0274d3581845c137\` ON \`sign_in_failure\``);
        await queryRunner.query(`DROP TABLE \`sign_in_failure\``);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`sign_in_failure\` (\`id\` bigint NOT NULL AUTO_INCREMENT, \`email\` varchar(254) NOT NULL, \`ip\` varchar(64) NOT NULL, \`at\` datetime(3) NOT NULL, INDEX \`IDX_903cb2e37d0274d3581845c137\` (\`ip\`, \`at\`), INDEX \`IDX_1977f76c7f17cc82bb9aa4a187\` (\`email\`, \`at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`DROP INDEX \`IDX_auth_rate_counter_window\` ON \`auth_rate_counter\``);
        await queryRunner.query(`DROP TABLE \`auth_rate_counter\``);
        await queryRunner.query(`ALTER TABLE \`user\` DROP COLUMN \`tokenVersion\``);
    }

}
