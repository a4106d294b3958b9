// Reviewed: season runs, the stored vector clock per district/profile/day, weekly tiers with their drivers,
// district profiles, versioned tier settings and the per-district input fingerprint of the last run.
import { MigrationInterface, QueryRunner } from "typeorm";

export class SeasonRun1796165312435 implements MigrationInterface {
    name = 'SeasonRun1796165312435'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "district_profiles" (
                "district_id" uuid NOT NULL,
                "profile_id" text NOT NULL,
                "biofix" text,
                CONSTRAINT "PK_a0821c52b5e764d670be7b84ebe" PRIMARY KEY ("district_id", "profile_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "district_run_state" (
                "district_id" uuid NOT NULL,
                "season_year" integer NOT NULL,
                "as_of" date NOT NULL,
                "fingerprint" text NOT NULL,
                "run_id" uuid NOT NULL,
                CONSTRAINT "PK_3389bab45f5b4d95c81301fab84" PRIMARY KEY ("district_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "district_tiers" (
                "district_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "run_id" uuid NOT NULL,
                "computed_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "as_of" date NOT NULL,
                "score" real NOT NULL,
                "tier" text NOT NULL,
                "tier_low" text NOT NULL,
                "tier_high" text NOT NULL,
                "confidence" text NOT NULL,
                "drivers" jsonb NOT NULL,
                "notes" jsonb NOT NULL,
                "leading_driver" text,
                "changed_driver" text,
                "profile_id" text,
                "cases_this_week" integer,
                "channel_zone" text,
                "latest_weather" date,
                CONSTRAINT "district_tiers_tier_check" CHECK (
                    tier IN ('baseline', 'raised', 'high', 'critical')
                ),
                CONSTRAINT "PK_67afa50ac4b29ebafa003585e2c" PRIMARY KEY ("district_id", "epi_year", "epi_week")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "district_tiers_week_idx" ON "district_tiers" ("epi_year", "epi_week")
        `);
        await queryRunner.query(`
            CREATE TABLE "season_runs" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "kind" text NOT NULL,
                "full" boolean NOT NULL DEFAULT false,
                "status" text NOT NULL,
                "requested_by" uuid,
                "started_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "finished_at" TIMESTAMP WITH TIME ZONE,
                "as_of" date NOT NULL,
                "districts_total" integer NOT NULL DEFAULT '0',
                "districts_done" integer NOT NULL DEFAULT '0',
                "districts_skipped" integer NOT NULL DEFAULT '0',
                "rows_written" integer NOT NULL DEFAULT '0',
                "warnings" jsonb NOT NULL DEFAULT '[]',
                "error" text,
                CONSTRAINT "season_runs_kind_check" CHECK (kind IN ('nightly', 'manual')),
                CONSTRAINT "season_runs_status_check" CHECK (status IN ('running', 'succeeded', 'failed')),
                CONSTRAINT "PK_2aba283ab1b242ba92c9109aa8f" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "season_runs_started_idx" ON "season_runs" ("started_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "tier_settings_versions" (
                "id" SERIAL NOT NULL,
                "settings" jsonb NOT NULL,
                "changed_by" uuid,
                "reason" text NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_09c16f1c6fa2bacb7652ade3de6" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "vector_clock_days" (
                "district_id" uuid NOT NULL,
                "profile_id" text NOT NULL,
                "date" date NOT NULL,
                "degree_days" real,
                "cumulative_degree_days" real NOT NULL,
                "complete" boolean NOT NULL,
                "generations" real NOT NULL,
                "eip_days" real,
                "survival" real,
                "survival_through_eip" real,
                "eip_share" real,
                "rvc" real,
                "rvc_low" real,
                "rvc_high" real,
                "season_open" boolean NOT NULL,
                CONSTRAINT "PK_c1b809fee1a7d2cc89055c54a5a" PRIMARY KEY ("district_id", "profile_id", "date")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "district_profiles"
            ADD CONSTRAINT "FK_cb3f7b4bb1835ba446c8b034d3c" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "district_profiles" DROP CONSTRAINT "FK_cb3f7b4bb1835ba446c8b034d3c"
        `);
        await queryRunner.query(`
            DROP TABLE "vector_clock_days"
        `);
        await queryRunner.query(`
            DROP TABLE "tier_settings_versions"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."season_runs_started_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "season_runs"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."district_tiers_week_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "district_tiers"
        `);
        await queryRunner.query(`
            DROP TABLE "district_run_state"
        `);
        await queryRunner.query(`
            DROP TABLE "district_profiles"
        `);
    }

}
