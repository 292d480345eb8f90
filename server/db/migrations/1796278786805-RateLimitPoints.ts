import { MigrationInterface, QueryRunner } from "typeorm";

/** rate-limiter-flexible's MySQL store (server/http/rate-limits.ts): made here, never by the library at runtime. */
export class RateLimitPoints1796278786805 implements MigrationInterface {
    name = 'RateLimitPoints1796278786805'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`rate_limit_points\` (\`key\` varchar(255) CHARACTER SET "ascii" COLLATE "ascii_bin" NOT NULL, \`points\` int NOT NULL DEFAULT '0', \`expire\` bigint UNSIGNED NULL, INDEX \`IDX_rate_limit_points_expire\` (\`expire\`), PRIMARY KEY (\`key\`)) ENGINE=InnoDB`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX \`IDX_rate_limit_points_expire\` ON \`rate_limit_points\``);
        await queryRunner.query(`DROP TABLE \`rate_limit_points\``);
    }

}
