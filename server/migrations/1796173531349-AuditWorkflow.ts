import { MigrationInterface, QueryRunner } from "typeorm";

export class AuditWorkflow1796173531349 implements MigrationInterface {
    name = 'AuditWorkflow1796173531349'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`audits\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`regionId\` int NOT NULL, \`candidateIds\` json NOT NULL, \`status\` varchar(20) NOT NULL DEFAULT 'queued', \`progress\` double NOT NULL DEFAULT '0', \`settings\` json NOT NULL, \`engineVersion\` varchar(40) NOT NULL, \`inputHash\` char(64) NOT NULL, \`timings\` json NULL, \`error\` text NULL, \`createdById\` int NOT NULL, \`startedAt\` datetime(3) NULL, \`finishedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_3d1c73692d02cfa1f8da1ee918\` (\`projectId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`candidates\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`label\` varchar(160) NOT NULL, \`definition\` text NOT NULL, \`resolved\` text NOT NULL, \`family\` varchar(40) NOT NULL, \`origin\` varchar(20) NOT NULL, \`reason\` varchar(500) NULL, \`params\` json NULL, \`createdById\` int NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_9b919a7fb1c078634c61f06624\` (\`projectId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`map_projects\` (\`id\` int NOT NULL AUTO_INCREMENT, \`studioId\` int NOT NULL, \`title\` varchar(160) NOT NULL, \`clientName\` varchar(160) NOT NULL, \`purpose\` varchar(20) NOT NULL, \`scaleBand\` varchar(20) NOT NULL, \`notes\` text NULL, \`status\` varchar(20) NOT NULL DEFAULT 'draft', \`createdById\` int NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_ccea183d44e27818b314f03223\` (\`studioId\`, \`updatedAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`project_access\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`userId\` int NOT NULL, \`grantedById\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_c686808371c4302bc84fef95ab\` (\`projectId\`, \`userId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`regions\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`name\` varchar(200) NOT NULL, \`sourceFileName\` varchar(255) NOT NULL, \`sourceFormat\` varchar(20) NOT NULL, \`sourceCrs\` text NOT NULL, \`geometry\` json NOT NULL, \`sha256\` char(64) NOT NULL, \`areaKm2\` double NOT NULL, \`bbox\` json NOT NULL, \`vertexCount\` int NOT NULL, \`partCount\` int NOT NULL, \`holeCount\` int NOT NULL, \`report\` json NOT NULL, \`isCurrent\` tinyint NOT NULL DEFAULT 1, \`createdById\` int NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_aa09a0c1d379c4d734240777db\` (\`projectId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`scorecards\` (\`id\` int NOT NULL AUTO_INCREMENT, \`auditId\` int NOT NULL, \`candidateId\` int NOT NULL, \`studioId\` int NOT NULL, \`metrics\` json NOT NULL, \`fields\` longblob NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_f63b53e23b0e9fc0aaa44555d3\` (\`auditId\`, \`candidateId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX \`IDX_f63b53e23b0e9fc0aaa44555d3\` ON \`scorecards\``);
        await queryRunner.query(`DROP TABLE \`scorecards\``);
        await queryRunner.query(`DROP INDEX \`IDX_aa09a0c1d379c4d734240777db\` ON \`regions\``);
        await queryRunner.query(`DROP TABLE \`regions\``);
        await queryRunner.query(`DROP INDEX \`IDX_c686808371c4302bc84fef95ab\` ON \`project_access\``);
        await queryRunner.query(`DROP TABLE \`project_access\``);
        await queryRunner.query(`DROP INDEX \`IDX_ccea183d44e27818b314f03223\` ON \`map_projects\``);
        await queryRunner.query(`DROP TABLE \`map_projects\``);
        await queryRunner.query(`DROP INDEX \`IDX_9b919a7fb1c078634c61f06624\` ON \`candidates\``);
        await queryRunner.query(`DROP TABLE \`candidates\``);
        await queryRunner.query(`DROP INDEX \`IDX_3d1c73692d02cfa1f8da1ee918\` ON \`audits\``);
        await queryRunner.query(`DROP TABLE \`audits\``);
    }

}
