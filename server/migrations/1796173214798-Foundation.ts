import { MigrationInterface, QueryRunner } from "typeorm";

export class Foundation1796173214798 implements MigrationInterface {
    name = 'Foundation1796173214798'

    public async up(queryRunner: QueryRunner): Promise<void> {
        // Sessions table in the shape express-mysql-session reads and writes.
        await queryRunner.query(`CREATE TABLE \`sessions\` (\`session_id\` varchar(128) COLLATE utf8mb4_bin NOT NULL, \`expires\` int unsigned NOT NULL, \`data\` mediumtext COLLATE utf8mb4_bin, PRIMARY KEY (\`session_id\`), INDEX \`IDX_sessions_expires\` (\`expires\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`invitations\` (\`id\` int NOT NULL AUTO_INCREMENT, \`kind\` varchar(20) NOT NULL DEFAULT 'invite', \`studioId\` int NULL, \`email\` varchar(254) NOT NULL, \`role\` varchar(20) NULL, \`tokenHash\` char(64) NOT NULL, \`expiresAt\` datetime(3) NOT NULL, \`usedAt\` datetime(3) NULL, \`invitedById\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_a6eb6f2543de8a5a4c148b32a1\` (\`tokenHash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`mail_log\` (\`id\` int NOT NULL AUTO_INCREMENT, \`studioId\` int NULL, \`toAddress\` varchar(254) NOT NULL, \`template\` varchar(60) NOT NULL, \`subject\` varchar(300) NOT NULL, \`status\` varchar(20) NOT NULL, \`error\` varchar(500) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`studios\` (\`id\` int NOT NULL AUTO_INCREMENT, \`name\` varchar(120) NOT NULL, \`seatCount\` int NOT NULL DEFAULT '3', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`users\` (\`id\` int NOT NULL AUTO_INCREMENT, \`email\` varchar(254) NOT NULL, \`name\` varchar(120) NOT NULL, \`passwordHash\` varchar(255) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_97672ac88f789774dd47f7c8be\` (\`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`memberships\` (\`id\` int NOT NULL AUTO_INCREMENT, \`userId\` int NOT NULL, \`studioId\` int NOT NULL, \`role\` varchar(20) NOT NULL, \`status\` varchar(20) NOT NULL DEFAULT 'active', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_b7e78870a5ed9d080793edbc5f\` (\`userId\`, \`studioId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`ALTER TABLE \`memberships\` ADD CONSTRAINT \`FK_187d573e43b2c2aa3960df20b78\` FOREIGN KEY (\`userId\`) REFERENCES \`users\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE \`memberships\` ADD CONSTRAINT \`FK_aa5c7c42b1eb3d2bab5781ddf62\` FOREIGN KEY (\`studioId\`) REFERENCES \`studios\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE \`memberships\` DROP FOREIGN KEY \`FK_aa5c7c42b1eb3d2bab5781ddf62\``);
        await queryRunner.query(`ALTER TABLE \`memberships\` DROP FOREIGN KEY \`FK_187d573e43b2c2aa3960df20b78\``);
        await queryRunner.query(`DROP INDEX \`IDX_b7e78870a5ed9d080793edbc5f\` ON \`memberships\``);
        await queryRunner.query(`DROP TABLE \`memberships\``);
        await queryRunner.query(`DROP INDEX \`IDX_97672ac88f789774dd47f7c8be\` ON \`users\``);
        await queryRunner.query(`DROP TABLE \`users\``);
        await queryRunner.query(`DROP TABLE \`studios\``);
        await queryRunner.query(`DROP TABLE \`mail_log\``);
        await queryRunner.query(`DROP INDEX \`IDX_a6eb6f2543de8a5a4c148b32a1\` ON \`invitations\``);
        await queryRunner.query(`DROP TABLE \`invitations\``);
        await queryRunner.query(`DROP TABLE \`sessions\``);
    }

}
