// Reviewed: one weekly bulletin per person (issue 16). bulletin_digests keeps each person's digest of a week
// (its named PDF, once; the HTML and text are on the outbox message), one per person and week; an outbox
// message points at the digest whose PDF it carries. Generated, with an unrelated constraint removed.
import { MigrationInterface, QueryRunner } from "typeorm";

export class BulletinDigests1796600400000 implements MigrationInterface {
    name = 'BulletinDigests1796600400000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "bulletin_digests" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "language" text NOT NULL,
                "layout" text NOT NULL,
                "district_ids" uuid array NOT NULL,
                "subject" text NOT NULL,
                "pdf_name" text NOT NULL,
                "pdf" bytea NOT NULL,
                "created_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "bulletin_digests_layout_check" CHECK (layout IN ('detail', 'overview')),
                CONSTRAINT "bulletin_digests_language_check" CHECK (language IN ('en', 'fr', 'es', 'pt')),
                CONSTRAINT "PK_9d83903998160cb6efcf34fc416" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "bulletin_digests_user_week_key" ON "bulletin_digests" ("user_id", "epi_year", "epi_week")
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages"
            ADD "digest_id" uuid
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletin_digests"
            ADD CONSTRAINT "FK_24391604764e2f83f2fd433fd61" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages"
            ADD CONSTRAINT "FK_cce809f68de665456e1baaa01b2" FOREIGN KEY ("digest_id") REFERENCES "bulletin_digests"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" DROP CONSTRAINT "FK_cce809f68de665456e1baaa01b2"
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletin_digests" DROP CONSTRAINT "FK_24391604764e2f83f2fd433fd61"
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" DROP COLUMN "digest_id"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."bulletin_digests_user_week_key"
        `);
        await queryRunner.query(`
            DROP TABLE "bulletin_digests"
        `);
    }

}
