// Reviewed: station-days move from one row each (weather_observations, keyed station and date) to one row per
// station and calendar year with an array per value (weather_station_years): a national upload then writes
// 5,000 rows instead of 1.8 million keyed rows (docs/weather-intake.md § Storage). The arrays hold one element
// per day of the year (NULL: no value) and are stored out of line without compression (float data barely
// compresses; skipping pglz saves the intake its cost). Values are checked by the intake before they are
// written (shared/weather/qc.ts); per-element CHECKs would cost a pass over every day of every write, so the
// table checks only that each year's arrays have one element per day. upload_ix points into uploads, a plain
// list (no FK, as upload_id was). weather_observations becomes a view of the same days for every reader.
import { MigrationInterface, QueryRunner } from "typeorm";

/** The stored days one row per station and day, as every reader and report sees them (a day without Tmin has no value). */
const OBSERVATIONS_VIEW = `
            CREATE VIEW "weather_observations" AS
            SELECT y."station_id", make_date(y."year", 1, 1) + (d.i - 1)::int AS "date",
                   d."tmin", d."tmax", d."rh", d."rain",
                   array_remove(ARRAY[CASE WHEN d.bits & 1 <> 0 THEN 'jump' END, CASE WHEN d.bits & 2 <> 0 THEN 'run' END,
                                      CASE WHEN d.bits & 4 <> 0 THEN 'spatial' END], NULL) AS "flags",
                   y."uploads"[d.ix] AS "upload_id", y."updated_at"
              FROM "weather_station_years" y
             CROSS JOIN LATERAL unnest(y."tmin", y."tmax", y."rh", y."rain", y."flags", y."upload_ix")
                   WITH ORDINALITY AS d("tmin", "tmax", "rh", "rain", bits, ix, i)
             WHERE d."tmin" IS NOT NULL
        `;

export class WeatherStationYears1796207332107 implements MigrationInterface {
    name = 'WeatherStationYears1796207332107'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "weather_station_years" (
                "station_id" uuid NOT NULL,
                "year" integer NOT NULL,
                "tmin" double precision array NOT NULL,
                "tmax" double precision array NOT NULL,
                "rh" double precision array NOT NULL,
                "rain" double precision array NOT NULL,
                "flags" smallint array NOT NULL,
                "upload_ix" smallint array NOT NULL,
                "uploads" uuid array NOT NULL,
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_57dc792ed8570af7c0c2b242994" PRIMARY KEY ("station_id", "year")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_station_years"
            ADD CONSTRAINT "FK_e9c780e7abd0f9e7dc20b316be1" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_station_years"
                ADD CONSTRAINT "weather_station_years_days_check" CHECK (
                    cardinality("tmin") = make_date("year" + 1, 1, 1) - make_date("year", 1, 1)
                    AND cardinality("tmax") = cardinality("tmin") AND cardinality("rh") = cardinality("tmin")
                    AND cardinality("rain") = cardinality("tmin") AND cardinality("flags") = cardinality("tmin")
                    AND cardinality("upload_ix") = cardinality("tmin")
                ),
                ALTER COLUMN "tmin" SET STORAGE EXTERNAL,
                ALTER COLUMN "tmax" SET STORAGE EXTERNAL,
                ALTER COLUMN "rh" SET STORAGE EXTERNAL,
                ALTER COLUMN "rain" SET STORAGE EXTERNAL,
                ALTER COLUMN "flags" SET STORAGE EXTERNAL,
                ALTER COLUMN "upload_ix" SET STORAGE EXTERNAL
        `);
        // The days stored so far, one row per station and year.
        await queryRunner.query(`
            INSERT INTO "weather_station_years" ("station_id", "year", "tmin", "tmax", "rh", "rain", "flags", "upload_ix", "uploads", "updated_at")
            SELECT k."station_id", k."year",
                   array_agg(o."tmin" ORDER BY g.d), array_agg(o."tmax" ORDER BY g.d),
                   array_agg(o."rh" ORDER BY g.d), array_agg(o."rain" ORDER BY g.d),
                   array_agg(((CASE WHEN 'jump' = ANY(o."flags") THEN 1 ELSE 0 END)
                            | (CASE WHEN 'run' = ANY(o."flags") THEN 2 ELSE 0 END)
                            | (CASE WHEN 'spatial' = ANY(o."flags") THEN 4 ELSE 0 END))::smallint ORDER BY g.d),
                   array_agg(coalesce(array_position(k."uploads", o."upload_id"), 0)::smallint ORDER BY g.d),
                   k."uploads", k."updated_at"
              FROM (SELECT "station_id", extract(year FROM "date")::int AS "year", max("updated_at") AS "updated_at",
                           coalesce(array_agg(DISTINCT "upload_id") FILTER (WHERE "upload_id" IS NOT NULL), '{}') AS "uploads"
                      FROM "weather_observations" GROUP BY 1, 2) k
             CROSS JOIN LATERAL generate_series(make_date(k."year", 1, 1), make_date(k."year", 12, 31), interval '1 day') AS g(d)
              LEFT JOIN "weather_observations" o ON o."station_id" = k."station_id" AND o."date" = g.d::date
             GROUP BY k."station_id", k."year", k."uploads", k."updated_at"
        `);
        await queryRunner.query(`DROP TABLE "weather_observations"`);
        await queryRunner.query(OBSERVATIONS_VIEW);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        // Back to one row per station and day (the earlier migration's table), with the same days.
        await queryRunner.query(`
            CREATE TABLE "weather_observations_rows" AS SELECT * FROM "weather_observations"
        `);
        await queryRunner.query(`DROP VIEW "weather_observations"`);
        await queryRunner.query(`
            CREATE TABLE "weather_observations" (
                "station_id" uuid NOT NULL,
                "date" date NOT NULL,
                "tmin" double precision NOT NULL,
                "tmax" double precision NOT NULL,
                "rh" double precision,
                "rain" double precision,
                "flags" text array NOT NULL DEFAULT '{}',
                "upload_id" uuid,
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "weather_observations_values_check" CHECK (
                    tmin <= tmax
                    AND (
                        rh IS NULL
                        OR rh BETWEEN 0 AND 100
                    )
                    AND (
                        rain IS NULL
                        OR rain >= 0
                    )
                ),
                CONSTRAINT "PK_3bccc5aef3db36bd8c5cee5808a" PRIMARY KEY ("station_id", "date")
            )
        `);
        await queryRunner.query(`
            INSERT INTO "weather_observations" SELECT * FROM "weather_observations_rows"
        `);
        await queryRunner.query(`DROP TABLE "weather_observations_rows"`);
        await queryRunner.query(`
            ALTER TABLE "weather_observations"
            ADD CONSTRAINT "FK_b232e3af81cda6b37b7bafd9eba" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_station_years" DROP CONSTRAINT "FK_e9c780e7abd0f9e7dc20b316be1"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_station_years"
        `);
    }

}
