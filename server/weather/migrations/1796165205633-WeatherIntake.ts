// Reviewed: stations (district by boundary), uploads with row-level issues, daily observations keyed (station_id, date)
// with CHECKs (upload_id is a plain pointer, no FK: a per-row check would slow a 2-million-row load) and their revisions, district sources (inside / IDW) and derived daily series; FKs cascade from stations.
import { MigrationInterface, QueryRunner } from "typeorm";

export class WeatherIntake1796165205633 implements MigrationInterface {
    name = 'WeatherIntake1796165205633'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "district_weather_days" (
                "district_id" uuid NOT NULL,
                "date" date NOT NULL,
                "tmin" double precision,
                "tmax" double precision,
                "rh" double precision,
                "rain" double precision,
                "filled" boolean NOT NULL DEFAULT false,
                "station_count" integer NOT NULL DEFAULT '0',
                CONSTRAINT "PK_1352d64dce6c9c68a4406145282" PRIMARY KEY ("district_id", "date")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "weather_stations" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "code" text NOT NULL,
                "name" text NOT NULL,
                "latitude" double precision NOT NULL,
                "longitude" double precision NOT NULL,
                "elevation" double precision,
                "active_from" date,
                "active_to" date,
                "is_demo" boolean NOT NULL DEFAULT false,
                "district_id" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "weather_stations_active_check" CHECK (
                    active_to IS NULL
                    OR active_from IS NULL
                    OR active_from <= active_to
                ),
                CONSTRAINT "weather_stations_lon_check" CHECK (
                    longitude BETWEEN -180 AND 180
                ),
                CONSTRAINT "weather_stations_lat_check" CHECK (
                    latitude BETWEEN -90 AND 90
                ),
                CONSTRAINT "PK_8ec823c1e5e6c884e558172339b" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "weather_stations_code_key" ON "weather_stations" ("code")
        `);
        await queryRunner.query(`
            CREATE INDEX "weather_stations_district_idx" ON "weather_stations" ("district_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "district_weather_sources" (
                "district_id" uuid NOT NULL,
                "station_id" uuid NOT NULL,
                "method" text NOT NULL,
                "distance_km" double precision NOT NULL,
                "weight" double precision NOT NULL,
                CONSTRAINT "district_weather_sources_method_check" CHECK (method IN ('inside', 'interpolated')),
                CONSTRAINT "PK_71964a951a82a7042fcec0cfe8e" PRIMARY KEY ("district_id", "station_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "weather_observation_revisions" (
                "id" BIGSERIAL NOT NULL,
                "station_id" uuid NOT NULL,
                "date" date NOT NULL,
                "tmin" double precision NOT NULL,
                "tmax" double precision NOT NULL,
                "rh" double precision,
                "rain" double precision,
                "flags" text array NOT NULL DEFAULT '{}',
                "previous_upload_id" uuid,
                "replaced_by_upload_id" uuid,
                "replaced_by" uuid,
                "replaced_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_64d00cff10e7aa001708b435194" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "weather_observation_revisions_key_idx" ON "weather_observation_revisions" ("station_id", "date")
        `);
        await queryRunner.query(`
            CREATE TABLE "weather_uploads" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "source" text NOT NULL,
                "file_name" text,
                "status" text NOT NULL DEFAULT 'processing',
                "temp_unit" text NOT NULL,
                "rain_unit" text NOT NULL,
                "bytes_total" bigint NOT NULL DEFAULT '0',
                "bytes_processed" bigint NOT NULL DEFAULT '0',
                "rows_processed" integer NOT NULL DEFAULT '0',
                "rows_accepted" integer NOT NULL DEFAULT '0',
                "rows_flagged" integer NOT NULL DEFAULT '0',
                "rows_rejected" integer NOT NULL DEFAULT '0',
                "rows_replaced" integer NOT NULL DEFAULT '0',
                "message" text,
                "created_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "heartbeat_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "finished_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "weather_uploads_units_check" CHECK (
                    temp_unit IN ('C', 'F')
                    AND rain_unit IN ('mm', 'in')
                ),
                CONSTRAINT "weather_uploads_source_check" CHECK (source IN ('upload', 'feed', 'correction')),
                CONSTRAINT "weather_uploads_status_check" CHECK (status IN ('processing', 'done', 'failed')),
                CONSTRAINT "PK_f4e0552d4e378727789c703b607" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "weather_uploads_status_idx" ON "weather_uploads" ("status", "heartbeat_at")
        `);
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
            CREATE TABLE "weather_upload_issues" (
                "id" BIGSERIAL NOT NULL,
                "upload_id" uuid NOT NULL,
                "row_number" integer,
                "station" text,
                "date" text,
                "column" text NOT NULL,
                "value" text,
                "severity" text NOT NULL,
                "rule" text NOT NULL,
                "reason" text NOT NULL,
                CONSTRAINT "weather_upload_issues_severity_check" CHECK (severity IN ('rejected', 'flagged', 'filled')),
                CONSTRAINT "PK_2ab3a4c7670d75189d7a0075b21" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "weather_upload_issues_upload_idx" ON "weather_upload_issues" ("upload_id", "row_number")
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_days"
            ADD CONSTRAINT "FK_48256a95b320a1f000fe93ee4b3" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_stations"
            ADD CONSTRAINT "FK_a1e3558c9d93ef52a522e180290" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_sources"
            ADD CONSTRAINT "FK_e42f521d2b429a0208f53e73260" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_sources"
            ADD CONSTRAINT "FK_76a0136ccec1ddf85d06cf657e1" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_observation_revisions"
            ADD CONSTRAINT "FK_e52872c8cc0cc4e4ef125297cd2" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_observations"
            ADD CONSTRAINT "FK_b232e3af81cda6b37b7bafd9eba" FOREIGN KEY ("station_id") REFERENCES "weather_stations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_upload_issues"
            ADD CONSTRAINT "FK_5b5883c9a65a1a20235f207468e" FOREIGN KEY ("upload_id") REFERENCES "weather_uploads"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);

    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "weather_upload_issues" DROP CONSTRAINT "FK_5b5883c9a65a1a20235f207468e"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_observations" DROP CONSTRAINT "FK_b232e3af81cda6b37b7bafd9eba"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_observation_revisions" DROP CONSTRAINT "FK_e52872c8cc0cc4e4ef125297cd2"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_sources" DROP CONSTRAINT "FK_76a0136ccec1ddf85d06cf657e1"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_sources" DROP CONSTRAINT "FK_e42f521d2b429a0208f53e73260"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_stations" DROP CONSTRAINT "FK_a1e3558c9d93ef52a522e180290"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_weather_days" DROP CONSTRAINT "FK_48256a95b320a1f000fe93ee4b3"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_upload_issues_upload_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_upload_issues"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_observations"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_uploads_status_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_uploads"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_observation_revisions_key_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_observation_revisions"
        `);
        await queryRunner.query(`
            DROP TABLE "district_weather_sources"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_stations_district_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_stations_code_key"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_stations"
        `);
        await queryRunner.query(`
            DROP TABLE "district_weather_days"
        `);
    }

}
