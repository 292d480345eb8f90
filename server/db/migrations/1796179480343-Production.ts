import { MigrationInterface, QueryRunner } from "typeorm";

export class Production1796179480343 implements MigrationInterface {
    name = 'Production1796179480343'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`ingredient\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(120) NOT NULL, \`kind\` varchar(12) NOT NULL, \`waterPercent\` decimal(5,2) NOT NULL DEFAULT '0.00', \`allergens\` varchar(300) NOT NULL DEFAULT '', \`packName\` varchar(60) NOT NULL, \`packGrams\` int NOT NULL, \`packCostCents\` int NOT NULL DEFAULT '0', \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_b6802ac7fbd37aa71d856a95d8\` (\`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`formula\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(120) NOT NULL, \`currentVersion\` int NOT NULL DEFAULT '1', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_d06f849472ad471206bfe1327e\` (\`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`formula_version\` (\`id\` int NOT NULL AUTO_INCREMENT, \`formulaId\` int NOT NULL, \`version\` int NOT NULL, \`body\` mediumtext NOT NULL, \`editedById\` int NULL, \`note\` varchar(200) NOT NULL DEFAULT '', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_c94f1e03ff08c19249a5498c77\` (\`formulaId\`, \`version\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`bake_day\` (\`date\` date NOT NULL, \`extraPans\` text NOT NULL, \`roomC\` decimal(4,1) NOT NULL DEFAULT '22.0', \`flourC\` decimal(4,1) NOT NULL DEFAULT '20.0', \`pasteC\` decimal(4,1) NOT NULL DEFAULT '30.0', \`frozenPlan\` mediumtext NULL, \`frozenAt\` datetime(3) NULL, \`progress\` text NOT NULL, \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (\`date\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`mixerCapacityKg\` decimal(6,2) NOT NULL DEFAULT '20.00'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`dispatchTime\` char(5) NOT NULL DEFAULT '06:30'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`ovens\` int NOT NULL DEFAULT '1'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`pansPerLoad\` int NOT NULL DEFAULT '6'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`pansPerLoad\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`ovens\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`dispatchTime\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`mixerCapacityKg\``);
        await queryRunner.query(`DROP TABLE \`bake_day\``);
        await queryRunner.query(`DROP INDEX \`IDX_c94f1e03ff08c19249a5498c77\` ON \`formula_version\``);
        await queryRunner.query(`DROP TABLE \`formula_version\``);
        await queryRunner.query(`DROP INDEX \`IDX_d06f849472ad471206bfe1327e\` ON \`formula\``);
        await queryRunner.query(`DROP TABLE \`formula\``);
        await queryRunner.query(`DROP INDEX \`IDX_b6802ac7fbd37aa71d856a95d8\` ON \`ingredient\``);
        await queryRunner.query(`DROP TABLE \`ingredient\``);
    }

}
