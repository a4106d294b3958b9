// Reviewed (issue 19): field teams, kept by the health officer: base district (a district in use as a base
// cannot be deleted: RESTRICT), the kinds of work trained for, district-days a week (1–7), and the members.
// Constraint names are given in the entities, so the check finds no drift.
import { MigrationInterface, QueryRunner } from "typeorm";

export class FieldTeams1796600900000 implements MigrationInterface {
    name = 'FieldTeams1796600900000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "field_teams" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "name" text NOT NULL,
                "base_district_id" uuid NOT NULL,
                "kinds" text array NOT NULL,
                "days_per_week" integer NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "field_teams_days_check" CHECK (
                    days_per_week BETWEEN 1 AND 7
                ),
                CONSTRAINT "PK_b2885bd4388c5827bbdaface3fc" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "field_teams_name_key" ON "field_teams" ("name")
        `);
        await queryRunner.query(`
            CREATE INDEX "field_teams_base_idx" ON "field_teams" ("base_district_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "field_team_members" (
                "team_id" uuid NOT NULL,
                "user_id" uuid NOT NULL,
                CONSTRAINT "PK_0ed7f381964a9f75266dc95530a" PRIMARY KEY ("team_id", "user_id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "field_team_members_user_idx" ON "field_team_members" ("user_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "field_teams"
            ADD CONSTRAINT "field_teams_base_district_id_fkey" FOREIGN KEY ("base_district_id") REFERENCES "districts"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_team_members"
            ADD CONSTRAINT "field_team_members_team_id_fkey" FOREIGN KEY ("team_id") REFERENCES "field_teams"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_team_members"
            ADD CONSTRAINT "field_team_members_user_id_fkey" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "field_team_members" DROP CONSTRAINT "field_team_members_user_id_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_team_members" DROP CONSTRAINT "field_team_members_team_id_fkey"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_teams" DROP CONSTRAINT "field_teams_base_district_id_fkey"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."field_team_members_user_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "field_team_members"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."field_teams_base_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."field_teams_name_key"
        `);
        await queryRunner.query(`
            DROP TABLE "field_teams"
        `);
    }

}
