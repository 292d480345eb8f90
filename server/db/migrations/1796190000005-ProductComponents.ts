import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Product components (toppings, washes, fillings, garnishes per piece or per pan), the explicit
 * "bought in / not planned" choice, and the product's own bake temperature, bake and cool minutes.
 */
export class ProductComponents1796190000005 implements MigrationInterface {
    name = 'ProductComponents1796190000005'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`product_component\` (\`id\` int NOT NULL AUTO_INCREMENT, \`productId\` int NOT NULL, \`sortOrder\` int NOT NULL DEFAULT '0', \`kind\` varchar(12) NOT NULL, \`name\` varchar(80) NOT NULL DEFAULT '', \`ingredientId\` int NOT NULL, \`grams\` decimal(8,1) NOT NULL, \`per\` varchar(8) NOT NULL, \`note\` varchar(200) NOT NULL DEFAULT '', INDEX \`IDX_product_component_product\` (\`productId\`, \`sortOrder\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`boughtIn\` tinyint NOT NULL DEFAULT 0`);
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`bakeTempC\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`bakeMinutes\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`product\` ADD \`coolMinutes\` int NULL`);
        await queryRunner.query(`ALTER TABLE \`product_component\` ADD CONSTRAINT \`FK_2f09c54cc7ca0deaa59141bae3f\` FOREIGN KEY (\`productId\`) REFERENCES \`product\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`product_component\` ADD CONSTRAINT \`FK_6a8e3436acbc21a1063f0248149\` FOREIGN KEY (\`ingredientId\`) REFERENCES \`ingredient\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`product_component\` DROP FOREIGN KEY \`FK_6a8e3436acbc21a1063f0248149\``);
        await queryRunner.query(`ALTER TABLE \`product_component\` DROP FOREIGN KEY \`FK_2f09c54cc7ca0deaa59141bae3f\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`coolMinutes\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`bakeMinutes\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`bakeTempC\``);
        await queryRunner.query(`ALTER TABLE \`product\` DROP COLUMN \`boughtIn\``);
        await queryRunner.query(`DROP INDEX \`IDX_product_component_product\` ON \`product_component\``);
        await queryRunner.query(`DROP TABLE \`product_component\``);
    }

}
