// Reviewed (issue 16, items 1 and 2): plausibility before the model and hand corrections win.
// - A station-day judged implausible by the intake is *held*: flag bit 8 ('held' in weather_observations),
//   left out of the district series until a person confirms or corrects it. Its report lines have the
//   severity 'held', the reason as a rule code (looks_fahrenheit, unlike_station_history, …) and their
//   figures in `params`; the upload counts its held rows (rows_held) and the rows kept back because a
//   hand correction stands (rows_conflicting).
// - weather_observation_conflicts: a value a feed or an upload brought for a day corrected by hand, kept
//   beside the correction until a person keeps the correction or takes the new value (at most one open
//   conflict per station and day: a newer value replaces the older open one).
// Written to match the entities (checked with migration:check); the view is not an entity.
import { MigrationInterface, QueryRunner } from 'typeorm';

const view = (withHeld: boolean) => `
            CREATE OR REPLACE VIEW "weather_observations" AS
            SELECT y."station_id", make_date(y."year", 1, 1) + (d.i - 1)::int AS "date",
                   d."tmin", d."tmax", d."rh", d."rain",
                   array_remove(ARRAY[CASE WHEN d.bits & 1 <> 0 THEN 'jump' END, CASE WHEN d.bits & 2 <> 0 THEN 'run' END,
                                      CASE WHEN d.bits & 4 <> 0 THEN 'spatial' END${withHeld ? `, CASE WHEN d.bits & 8 <> 0 THEN 'held' END` : ''}], NULL) AS "flags",
                   y."uploads"[d.ix] AS "upload_id", y."updated_at"
              FROM "weather_station_years" y
             CROSS JOIN LATERAL unnest(y."tmin", y."tmax", y."rh", y."rain", y."flags", y."upload_ix")
                   WITH ORDINALITY AS d("tmin", "tmax", "rh", "rain", bits, ix, i)
             WHERE d."tmin" IS NOT NULL
        `;

export class HeldAndConflicts1796600100000 implements MigrationInterface {
  name = 'HeldAndConflicts1796600100000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(view(true));
    await queryRunner.query(`ALTER TABLE "weather_uploads" ADD "rows_held" integer NOT NULL DEFAULT 0`);
    await queryRunner.query(`ALTER TABLE "weather_uploads" ADD "rows_conflicting" integer NOT NULL DEFAULT 0`);
    await queryRunner.query(`ALTER TABLE "weather_upload_issues" DROP CONSTRAINT "weather_upload_issues_severity_check"`);
    await queryRunner.query(`ALTER TABLE "weather_upload_issues" ADD "params" jsonb`);
    await queryRunner.query(
      `ALTER TABLE "weather_upload_issues" ADD CONSTRAINT "weather_upload_issues_severity_check" CHECK (severity IN ('rejected', 'flagged', 'filled', 'held'))`,
    );
    await queryRunner.query(`
            CREATE TABLE "weather_observation_conflicts" (
                "id" BIGSERIAL NOT NULL,
                "station_id" uuid NOT NULL,
                "date" date NOT NULL,
                "tmin" double precision NOT NULL,
                "tmax" double precision NOT NULL,
                "rh" double precision,
                "rain" double precision,
                "upload_id" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "resolved_at" TIMESTAMP WITH TIME ZONE,
                "resolved_by" uuid,
                "choice" text,
                "reason" text,
                CONSTRAINT "weather_observation_conflicts_choice_check" CHECK (choice IS NULL OR choice IN ('keep', 'take')),
                CONSTRAINT "PK_weather_observation_conflicts" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(
      `CREATE UNIQUE INDEX "weather_observation_conflicts_open_idx" ON "weather_observation_conflicts" ("station_id", "date") WHERE resolved_at IS NULL`,
    );
    await queryRunner.query(`
            ALTER TABLE "weather_observation_conflicts"
            ADD CONSTRAINT "FK_weather_observation_conflicts_station" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "weather_observation_conflicts"`);
    await queryRunner.query(`DELETE FROM "weather_upload_issues" WHERE severity = 'held'`);
    await queryRunner.query(`ALTER TABLE "weather_upload_issues" DROP CONSTRAINT "weather_upload_issues_severity_check"`);
    await queryRunner.query(`ALTER TABLE "weather_upload_issues" DROP COLUMN "params"`);
    await queryRunner.query(
      `ALTER TABLE "weather_upload_issues" ADD CONSTRAINT "weather_upload_issues_severity_check" CHECK (severity IN ('rejected', 'flagged', 'filled'))`,
    );
    await queryRunner.query(`ALTER TABLE "weather_uploads" DROP COLUMN "rows_conflicting"`);
    await queryRunner.query(`ALTER TABLE "weather_uploads" DROP COLUMN "rows_held"`);
    await queryRunner.query(view(false));
  }
}
