// Reviewed (issue 19, items 1, 2): teams may be retired (kept for the weeks that name them, left out of new
// proposals); the Field week may wait for a supervisor's approval (status 'awaiting_approval', who sent it,
// who reviewed it and the reason of a send-back); the one-row field settings hold whether approval is required.
// Written by hand in the generator's shape; constraint names are given in the entities, so the check finds no drift.
import { MigrationInterface, QueryRunner } from "typeorm";

export class FieldApproval1796601500000 implements MigrationInterface {
    name = 'FieldApproval1796601500000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "field_teams" ADD "retired_at" TIMESTAMP WITH TIME ZONE`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD "submitted_at" TIMESTAMP WITH TIME ZONE`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD "submitted_by" uuid`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD "reviewed_at" TIMESTAMP WITH TIME ZONE`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD "reviewed_by" uuid`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD "review_reason" text`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_status_check"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD CONSTRAINT "field_weeks_status_check" CHECK (status IN ('draft', 'awaiting_approval', 'published'))`);
        await queryRunner.query(`
            ALTER TABLE "field_weeks"
            ADD CONSTRAINT "field_weeks_submitted_by_fkey" FOREIGN KEY ("submitted_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_weeks"
            ADD CONSTRAINT "field_weeks_reviewed_by_fkey" FOREIGN KEY ("reviewed_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            CREATE TABLE "field_settings" (
                "id" smallint NOT NULL DEFAULT '1',
                "approval_required" boolean NOT NULL DEFAULT false,
                "updated_by" uuid,
                "updated_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "field_settings_single_row" CHECK (id = 1),
                CONSTRAINT "field_settings_pkey" PRIMARY KEY ("id")
            )
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TABLE "field_settings"`);
        await queryRunner.query(`UPDATE "field_weeks" SET status = 'draft' WHERE status = 'awaiting_approval'`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_reviewed_by_fkey"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_submitted_by_fkey"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP CONSTRAINT "field_weeks_status_check"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" ADD CONSTRAINT "field_weeks_status_check" CHECK (status IN ('draft', 'published'))`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP COLUMN "review_reason"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP COLUMN "reviewed_by"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP COLUMN "reviewed_at"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP COLUMN "submitted_by"`);
        await queryRunner.query(`ALTER TABLE "field_weeks" DROP COLUMN "submitted_at"`);
        await queryRunner.query(`ALTER TABLE "field_teams" DROP COLUMN "retired_at"`);
    }

}
