import { MigrationInterface, QueryRunner } from "typeorm";

export class ReviewSignOff1796173789430 implements MigrationInterface {
    name = 'ReviewSignOff1796173789430'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE \`activity_events\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`actorId\` int NULL, \`actorName\` varchar(120) NOT NULL, \`actorRole\` varchar(20) NOT NULL, \`kind\` varchar(60) NOT NULL, \`summary\` varchar(300) NOT NULL, \`details\` json NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_6cf03ee4085704d009023c36df\` (\`projectId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`project_comments\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`authorId\` int NOT NULL, \`authorName\` varchar(120) NOT NULL, \`authorRole\` varchar(20) NOT NULL, \`body\` text NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_658fc594d96da1098b081f5f07\` (\`projectId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`review_recipients\` (\`id\` int NOT NULL AUTO_INCREMENT, \`roundId\` int NOT NULL, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`email\` varchar(254) NOT NULL, \`userId\` int NULL, \`invited\` tinyint NOT NULL DEFAULT 0, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_02ff913875476761ada4729350\` (\`studioId\`, \`email\`), UNIQUE INDEX \`IDX_2687ae08597b5f3f5d9f6bac82\` (\`roundId\`, \`email\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`review_rounds\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`auditId\` int NOT NULL, \`roundNumber\` int NOT NULL, \`candidateIds\` json NOT NULL, \`shortlist\` json NOT NULL, \`recommendation\` text NOT NULL, \`requestedById\` int NOT NULL, \`status\` varchar(20) NOT NULL DEFAULT 'open', \`decidedById\` int NULL, \`decidedAt\` datetime(3) NULL, \`decisionComment\` text NULL, \`chosenCandidateId\` int NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_b5750f7b3de0697e9cee5af046\` (\`projectId\`, \`roundNumber\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        await queryRunner.query(`CREATE TABLE \`sign_offs\` (\`id\` int NOT NULL AUTO_INCREMENT, \`projectId\` int NOT NULL, \`studioId\` int NOT NULL, \`roundId\` int NOT NULL, \`auditId\` int NOT NULL, \`candidateId\` int NOT NULL, \`recordJson\` longtext NOT NULL, \`recordHash\` char(64) NOT NULL, \`reviewerUserId\` int NOT NULL, \`reviewerName\` varchar(120) NOT NULL, \`reviewerEmail\` varchar(254) NOT NULL, \`signature\` varchar(120) NOT NULL, \`comment\` text NULL, \`approvedAt\` datetime(3) NOT NULL, INDEX \`IDX_2a0d2139bb0b297a83a6fbf87e\` (\`projectId\`), UNIQUE INDEX \`IDX_c479bbe5b18e2cb09ea22337ef\` (\`roundId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
        // A sign-off is a record of fact: the database itself refuses to change or remove one,
        // whatever client or script connects (MariaDB SIGNAL, SQLSTATE 45000 = user-defined error).
        await queryRunner.query(`CREATE TRIGGER \`sign_offs_no_update\` BEFORE UPDATE ON \`sign_offs\` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Sign-off records are immutable: UPDATE refused.'`);
        await queryRunner.query(`CREATE TRIGGER \`sign_offs_no_delete\` BEFORE DELETE ON \`sign_offs\` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Sign-off records are immutable: DELETE refused.'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TRIGGER IF EXISTS \`sign_offs_no_delete\``);
        await queryRunner.query(`DROP TRIGGER IF EXISTS \`sign_offs_no_update\``);
        await queryRunner.query(`DROP INDEX \`IDX_c479bbe5b18e2cb09ea22337ef\` ON \`sign_offs\``);
        await queryRunner.query(`DROP INDEX \`IDX_2a0d2139bb0b297a83a6fbf87e\` ON \`sign_offs\``);
        await queryRunner.query(`DROP TABLE \`sign_offs\``);
        await queryRunner.query(`DROP INDEX \`IDX_b5750f7b3de0697e9cee5af046\` ON \`review_rounds\``);
        await queryRunner.query(`DROP TABLE \`review_rounds\``);
        await queryRunner.query(`DROP INDEX \`IDX_2687ae08597b5f3f5d9f6bac82\` ON \`review_recipients\``);
        await queryRunner.query(`DROP INDEX \`IDX_02ff913875476761ada4729350\` ON \`review_recipients\``);
        await queryRunner.query(`DROP TABLE \`review_recipients\``);
        await queryRunner.query(`DROP INDEX \`IDX_658fc594d96da1098b081f5f07\` ON \`project_comments\``);
        await queryRunner.query(`DROP TABLE \`project_comments\``);
        await queryRunner.query(`DROP INDEX \`IDX_6cf03ee4085704d009023c36df\` ON \`activity_events\``);
        await queryRunner.query(`DROP TABLE \`activity_events\``);
    }

}
