import { MigrationInterface, QueryRunner } from "typeorm";

export class Ordering1796177957036 implements MigrationInterface {
    name = 'Ordering1796177957036'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`bakery_closure\` (\`date\` date NOT NULL, \`note\` varchar(120) NOT NULL DEFAULT '', PRIMARY KEY (\`date\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`product\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(120) NOT NULL, \`description\` text NOT NULL, \`photoFile\` varchar(80) NULL, \`saleUnit\` varchar(60) NOT NULL, \`piecesPerUnit\` int NOT NULL, \`pieceGrams\` int NOT NULL, \`panName\` varchar(60) NOT NULL, \`panLengthMm\` int NOT NULL, \`panWidthMm\` int NOT NULL, \`unitsPerPan\` int NOT NULL, \`priceCents\` int NOT NULL, \`minQuantity\` int NOT NULL DEFAULT '1', \`maxQuantity\` int NOT NULL DEFAULT '100', \`leadDays\` int NULL, \`allergens\` varchar(300) NOT NULL DEFAULT '', \`mayContain\` varchar(300) NOT NULL DEFAULT '', \`active\` tinyint NOT NULL DEFAULT 1, \`formulaId\` int NULL, \`sortOrder\` int NOT NULL DEFAULT '0', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`price_list\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(80) NOT NULL, \`kind\` varchar(10) NOT NULL, \`percentOff\` decimal(5,2) NOT NULL DEFAULT '0.00', UNIQUE INDEX \`IDX_2acd040582f9fa687a1106684e\` (\`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`price_list_item\` (\`id\` int NOT NULL AUTO_INCREMENT, \`priceListId\` int NOT NULL, \`productId\` int NOT NULL, \`priceCents\` int NOT NULL, UNIQUE INDEX \`IDX_c2dc28b896c76268904ba84991\` (\`priceListId\`, \`productId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`customer_order\` (\`id\` int NOT NULL AUTO_INCREMENT, \`accountId\` int NOT NULL, \`deliveryDate\` date NOT NULL, \`status\` varchar(12) NOT NULL DEFAULT 'open', \`poNumber\` varchar(40) NULL, \`note\` varchar(500) NULL, \`totalCents\` int NOT NULL DEFAULT '0', \`source\` varchar(10) NOT NULL DEFAULT 'one_off', \`editedByHand\` tinyint NOT NULL DEFAULT 0, \`createdById\` int NULL, \`version\` int NOT NULL DEFAULT '1', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_102132edb75dde486ae43d64a9\` (\`deliveryDate\`, \`status\`), UNIQUE INDEX \`IDX_6fc8ac71ef934abf6068164700\` (\`accountId\`, \`deliveryDate\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`order_line\` (\`id\` int NOT NULL AUTO_INCREMENT, \`orderId\` int NOT NULL, \`productId\` int NOT NULL, \`productName\` varchar(120) NOT NULL, \`saleUnit\` varchar(60) NOT NULL, \`quantity\` int NOT NULL, \`unitPriceCents\` int NOT NULL, \`lineTotalCents\` int NOT NULL, INDEX \`IDX_8deef19c65f771528352b0f5a5\` (\`productId\`), UNIQUE INDEX \`IDX_63689c04aed04a4dbf08d3d375\` (\`orderId\`, \`productId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`idempotency_key\` (\`id\` int NOT NULL AUTO_INCREMENT, \`userId\` int NOT NULL, \`idemKey\` varchar(100) NOT NULL, \`requestHash\` char(64) NOT NULL, \`status\` int NOT NULL, \`body\` mediumtext NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_c30e5e0df622aff1af3ff2c5f0\` (\`userId\`, \`idemKey\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`standing_order\` (\`id\` int NOT NULL AUTO_INCREMENT, \`accountId\` int NOT NULL, \`startDate\` date NOT NULL, \`endDate\` date NULL, \`intervalWeeks\` int NOT NULL DEFAULT '1', \`rrule\` varchar(500) NOT NULL, \`skipDates\` text NOT NULL, \`active\` tinyint NOT NULL DEFAULT 1, \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_5bce6d0805ea647866cea780b8\` (\`accountId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`standing_order_line\` (\`id\` int NOT NULL AUTO_INCREMENT, \`standingOrderId\` int NOT NULL, \`productId\` int NOT NULL, \`weekday\` int NOT NULL, \`quantity\` int NOT NULL, UNIQUE INDEX \`IDX_231064185723e842369621836d\` (\`standingOrderId\`, \`productId\`, \`weekday\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`deliveryWeekdays\` varchar(20) NOT NULL DEFAULT '2,3,4,5,6'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`cutoffTime\` char(5) NOT NULL DEFAULT '14:00'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`leadDays\` int NOT NULL DEFAULT '1'`);
        await queryRunner.query(`ALTER TABLE \`bakery\` ADD \`horizonDays\` int NOT NULL DEFAULT '28'`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`routeWeekdays\` varchar(20) NULL`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`minimumOrderCents\` int NOT NULL DEFAULT '0'`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`priceListId\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD \`feedToken\` varchar(64) NULL`);
        await queryRunner.query(`ALTER TABLE \`customer_account\` ADD UNIQUE INDEX \`IDX_89c81aec492fab4f7fa7df3950\` (\`feedToken\`)`);
        await queryRunner.query(`ALTER TABLE \`order_line\` ADD CONSTRAINT \`FK_239cfca2a55b98b90b6bef2e44f\` FOREIGN KEY (\`orderId\`) REFERENCES \`customer_order\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`order_line\` DROP FOREIGN KEY \`FK_239cfca2a55b98b90b6bef2e44f\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP INDEX \`IDX_89c81aec492fab4f7fa7df3950\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`feedToken\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`priceListId\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`minimumOrderCents\``);
        await queryRunner.query(`ALTER TABLE \`customer_account\` DROP COLUMN \`routeWeekdays\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`horizonDays\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`leadDays\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`cutoffTime\``);
        await queryRunner.query(`ALTER TABLE \`bakery\` DROP COLUMN \`deliveryWeekdays\``);
        await queryRunner.query(`DROP INDEX \`IDX_231064185723e842369621836d\` ON \`standing_order_line\``);
        await queryRunner.query(`DROP TABLE \`standing_order_line\``);
        await queryRunner.query(`DROP INDEX \`IDX_5bce6d0805ea647866cea780b8\` ON \`standing_order\``);
        await queryRunner.query(`DROP TABLE \`standing_order\``);
        await queryRunner.query(`DROP INDEX \`IDX_c30e5e0df622aff1af3ff2c5f0\` ON \`idempotency_key\``);
        await queryRunner.query(`DROP TABLE \`idempotency_key\``);
        await queryRunner.query(`DROP INDEX \`IDX_63689c04aed04a4dbf08d3d375\` ON \`order_line\``);
        await queryRunner.query(`DROP INDEX \`IDX_8deef19c65f771528352b0f5a5\` ON \`order_line\``);
        await queryRunner.query(`DROP TABLE \`order_line\``);
        await queryRunner.query(`DROP INDEX \`IDX_6fc8ac71ef934abf6068164700\` ON \`customer_order\``);
        await queryRunner.query(`DROP INDEX \`IDX_102132edb75dde486ae43d64a9\` ON \`customer_order\``);
        await queryRunner.query(`DROP TABLE \`customer_order\``);
        await queryRunner.query(`DROP INDEX \`IDX_c2dc28b896c76268904ba84991\` ON \`price_list_item\``);
        await queryRunner.query(`DROP TABLE \`price_list_item\``);
        await queryRunner.query(`DROP INDEX \`IDX_2acd040582f9fa687a1106684e\` ON \`price_list\``);
        await queryRunner.query(`DROP TABLE \`price_list\``);
        await queryRunner.query(`DROP TABLE \`product\``);
        await queryRunner.query(`DROP TABLE \`bakery_closure\``);
    }

}
