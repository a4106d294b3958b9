import { MigrationInterface, QueryRunner } from "typeorm";

export class VectorClockSeasons1796192751564 implements MigrationInterface {
    name = 'VectorClockSeasons1796192751564'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "vector_clock_seasons" (
                "district_id" uuid NOT NULL,
                "profile_id" text NOT NULL,
                "season_year" integer NOT NULL,
                "start_date" date NOT NULL,
                "days" integer NOT NULL,
                "degree_days" real array NOT NULL,
                "cumulative_degree_days" real array NOT NULL,
                "complete" boolean array NOT NULL,
                "generations" real array NOT NULL,
                "eip_days" real array NOT NULL,
                "survival" real array NOT NULL,
                "survival_through_eip" real array NOT NULL,
                "eip_share" real array NOT NULL,
                "rvc" real array NOT NULL,
                "rvc_low" real array NOT NULL,
                "rvc_high" real array NOT NULL,
                "season_open" boolean array NOT NULL,
                CONSTRAINT "PK_1d4f9a445f1dd8f19af5b0b3c63" PRIMARY KEY ("district_id", "profile_id", "season_year")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "vector_clock_seasons"
            ADD CONSTRAINT "FK_3c2871d05958e7d8f4502f33210" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        // The arrays are about 1.3 kB each: stored out of line without compression (float data barely
        // compresses, and skipping pglz saves the season run its cost).
        await queryRunner.query(`
            ALTER TABLE "vector_clock_seasons"
                ALTER COLUMN "degree_days" SET STORAGE EXTERNAL,
                ALTER COLUMN "cumulative_degree_days" SET STORAGE EXTERNAL,
                ALTER COLUMN "complete" SET STORAGE EXTERNAL,
                ALTER COLUMN "generations" SET STORAGE EXTERNAL,
                ALTER COLUMN "eip_days" SET STORAGE EXTERNAL,
                ALTER COLUMN "survival" SET STORAGE EXTERNAL,
                ALTER COLUMN "survival_through_eip" SET STORAGE EXTERNAL,
                ALTER COLUMN "eip_share" SET STORAGE EXTERNAL,
                ALTER COLUMN "rvc" SET STORAGE EXTERNAL,
                ALTER COLUMN "rvc_low" SET STORAGE EXTERNAL,
                ALTER COLUMN "rvc_high" SET STORAGE EXTERNAL,
                ALTER COLUMN "season_open" SET STORAGE EXTERNAL
        `);
        // The days stored so far, one row per season (each season's days are consecutive from its first).
        await queryRunner.query(`
            INSERT INTO "vector_clock_seasons" ("district_id", "profile_id", "season_year", "start_date", "days", "degree_days", "cumulative_degree_days", "complete", "generations", "eip_days", "survival", "survival_through_eip", "eip_share", "rvc", "rvc_low", "rvc_high", "season_open")
            SELECT "district_id", "profile_id", extract(year FROM "date")::int, min("date"), count(*)::int,
                   array_agg("degree_days" ORDER BY "date"),
                   array_agg("cumulative_degree_days" ORDER BY "date"),
                   array_agg("complete" ORDER BY "date"),
                   array_agg("generations" ORDER BY "date"),
                   array_agg("eip_days" ORDER BY "date"),
                   array_agg("survival" ORDER BY "date"),
                   array_agg("survival_through_eip" ORDER BY "date"),
                   array_agg("eip_share" ORDER BY "date"),
                   array_agg("rvc" ORDER BY "date"),
                   array_agg("rvc_low" ORDER BY "date"),
                   array_agg("rvc_high" ORDER BY "date"),
                   array_agg("season_open" ORDER BY "date")
              FROM "vector_clock_days"
             GROUP BY "district_id", "profile_id", extract(year FROM "date")
            HAVING max("date") - min("date") + 1 = count(*)
        `);
        await queryRunner.query(`DROP TABLE "vector_clock_days"`);
        // A season that was not consecutive (none is written so) is recomputed by the next run.
        await queryRunner.query(`
            DELETE FROM "district_run_state" r
             WHERE NOT EXISTS (SELECT 1 FROM "vector_clock_seasons" v WHERE v."district_id" = r."district_id")
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
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
            INSERT INTO "vector_clock_days" ("district_id", "profile_id", "date", "degree_days", "cumulative_degree_days", "complete", "generations", "eip_days", "survival", "survival_through_eip", "eip_share", "rvc", "rvc_low", "rvc_high", "season_open")
            SELECT s."district_id", s."profile_id", s."start_date" + (u.i - 1)::int, u.degree_days, u.cumulative_degree_days, u.complete, u.generations, u.eip_days, u.survival, u.survival_through_eip, u.eip_share, u.rvc, u.rvc_low, u.rvc_high, u.season_open
              FROM "vector_clock_seasons" s,
                   unnest(s."degree_days", s."cumulative_degree_days", s."complete", s."generations", s."eip_days", s."survival", s."survival_through_eip", s."eip_share", s."rvc", s."rvc_low", s."rvc_high", s."season_open") WITH ORDINALITY AS u(degree_days, cumulative_degree_days, complete, generations, eip_days, survival, survival_through_eip, eip_share, rvc, rvc_low, rvc_high, season_open, i)
        `);
        await queryRunner.query(`
            ALTER TABLE "vector_clock_seasons" DROP CONSTRAINT "FK_3c2871d05958e7d8f4502f33210"
        `);
        await queryRunner.query(`
            DROP TABLE "vector_clock_seasons"
        `);
    }

}
