import { MigrationInterface, QueryRunner } from "typeorm";

export class SeatBilling1796174078060 implements MigrationInterface {
    name = 'SeatBilling1796174078060'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`payment_events\` (\`id\` int NOT NULL AUTO_INCREMENT, \`eventId\` varchar(255) NOT NULL, \`type\` varchar(100) NOT NULL, \`studioId\` int NULL, \`eventCreated\` bigint NOT NULL, \`outcome\` varchar(20) NOT NULL, \`payload\` json NOT NULL, \`processedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_51c5cb44d59cad80f33fdcbc69\` (\`eventId\`), INDEX \`IDX_72a371a7293c7002b926bda71a\` (\`studioId\`, \`processedAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`seat_subscriptions\` (\`id\` int NOT NULL AUTO_INCREMENT, \`studioId\` int NOT NULL, \`customerId\` varchar(255) NOT NULL, \`subscriptionId\` varchar(255) NULL, \`subscriptionItemId\` varchar(255) NULL, \`quantity\` int NOT NULL DEFAULT '0', \`status\` varchar(20) NOT NULL DEFAULT 'none', \`currentPeriodEnd\` datetime(3) NULL, \`graceUntil\` datetime(3) NULL, \`cardBrand\` varchar(30) NULL, \`cardLast4\` char(4) NULL, \`lastEventCreated\` bigint NOT NULL DEFAULT '0', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_4df014ca69b29dfd08039a8cfb\` (\`studioId\`), UNIQUE INDEX \`IDX_3c9ab00537fa93c165cc1b0db9\` (\`customerId\`), UNIQUE INDEX \`IDX_66b3caeae22384149f6ad655c2\` (\`subscriptionId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`seat_subscriptions\` ADD CONSTRAINT \`FK_4df014ca69b29dfd08039a8cfb6\` FOREIGN KEY (\`studioId\`) REFERENCES \`studios\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`seat_subscriptions\` DROP FOREIGN KEY \`FK_4df014ca69b29dfd08039a8cfb6\``);
        await queryRunner.query(`DROP INDEX \`IDX_66b3caeae22384149f6ad655c2\` ON \`seat_subscriptions\``);
        await queryRunner.query(`DROP INDEX \`IDX_3c9ab00537fa93c165cc1b0db9\` ON \`seat_subscriptions\``);
        await queryRunner.query(`DROP INDEX \`IDX_4df014ca69b29dfd08039a8cfb\` ON \`seat_subscriptions\``);
        await queryRunner.query(`DROP TABLE \`seat_subscriptions\``);
        await queryRunner.query(`DROP INDEX \`IDX_72a371a7293c7002b926bda71a\` ON \`payment_events\``);
        await queryRunner.query(`DROP INDEX \`IDX_51c5cb44d59cad80f33fdcbc69\` ON \`payment_events\``);
        await queryRunner.query(`DROP TABLE \`payment_events\``);
    }

}
