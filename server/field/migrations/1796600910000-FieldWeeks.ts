// Reviewed (issue 19): the Field week (one per Monday, draft or published, with what the solver said as
// jsonb) and its days (one district per team and day); the outbox's kind check gains 'field-week'.
// Constraint names are given in the entities, so the check finds no drift.
import { MigrationInterface, QueryRunner } from "typeorm";

export class FieldWeeks1796600910000 implements MigrationInterface {
    name = 'FieldWeeks1796600910000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "field_weeks" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "week_start" date NOT NULL,
                "status" text NOT NULL DEFAULT 'draft',
                "proposal" jsonb NOT NULL,
                "edited" boolean NOT NULL DEFAULT false,
                "created_by" uuid,
                "published_at" TIMESTAMP WITH TIME ZONE,
                "published_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "field_weeks_status_check" CHECK (status IN ('draft', 'published')),
                CONSTRAINT "PK_2b8e9df282d52b53a63964553e2" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "field_weeks_week_start_key" ON "field_weeks" ("week_start")
        `);
        await queryRunner.query(`
            CREATE TABLE "field_week_days" (
                "field_week_id" uuid NOT NULL,
                "team_id" uuid NOT NULL,
                "day" date NOT NULL,
                "district_id" uuid NOT NULL,
                CONSTRAINT "PK_84db68a1a6a487de89d22f05f8d" PRIMARY KEY ("field_week_id", "team_id", "day")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "field_week_days_district_idx" ON "field_week_days" ("district_id", "day")
        `);
        await queryRunner.query(`
            ALTER TABLE "field_weeks"
            ADD CONSTRAINT "field_weeks_created_by_fkey" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_weeks"
            ADD CONSTRAINT "field_weeks_published_by_fkey" FOREIGN KEY ("published_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days"
            ADD CONSTRAINT "field_week_days_field_week_id_fkey" FOREIGN KEY ("field_week_id") REFERENCES "field_weeks"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days"
            ADD CONSTRAINT "field_week_days_team_id_fkey" FOREIGN KEY ("team_id") REFERENCES "field_teams"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days"
            ADD CONSTRAINT "field_week_days_district_id_fkey" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        // Written by hand (the generator does not compare CHECK constraints): the outbox may carry the plan's mails.
        await queryRunner.query(`ALTER TABLE "outbox_messages" DROP CONSTRAINT "outbox_messages_kind_check"`);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" ADD CONSTRAINT "outbox_messages_kind_check"
            CHECK (kind IN ('advisory', 'bulletin', 'invite', 'password-reset', 'field-week'))
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DELETE FROM "outbox_messages" WHERE kind = 'field-week'`);
        await queryRunner.query(`ALTER TABLE "outbox_messages" DROP CONSTRAINT "outbox_messages_kind_check"`);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" ADD CONSTRAINT "outbox_messages_kind_check"
            CHECK (kind IN ('advisory', 'bulletin', 'invite', 'password-reset'))
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days" DROP CONSTRAINT "field_week_days_district_id_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days" DROP CONSTRAINT "field_week_days_team_id_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_week_days" DROP CONSTRAINT "field_week_days_field_week_id_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_published_by_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_created_by_fkey"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."field_week_days_district_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "field_week_days"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."field_weeks_week_start_key"
        `);
        await queryRunner.query(`
            DROP TABLE "field_weeks"
        `);
    }

}
