// Reviewed: diseases (+ the four base ones), weekly case counts unique per district/disease/week with CHECKs >= 0, revisions, week closures, reporting start and epidemic-year settings, larval surveys; FKs cascade from districts, users SET NULL.
import { MigrationInterface, QueryRunner } from "typeorm";

export class CaseLedger1796165141357 implements MigrationInterface {
    name = 'CaseLedger1796165141357'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "diseases" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "code" text NOT NULL,
                "name" text NOT NULL,
                "profile_ids" text array NOT NULL DEFAULT '{}',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_79ddc936b1458d8a079b62dc210" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "diseases_code_key" ON "diseases" ("code")
        `);
        await queryRunner.query(`
            CREATE TABLE "case_channel_settings" (
                "district_id" uuid NOT NULL,
                "disease_id" uuid NOT NULL,
                "excluded_years" integer array NOT NULL DEFAULT '{}',
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "updated_by" uuid,
                CONSTRAINT "PK_36a5ffafa13cd87ccf3b0689817" PRIMARY KEY ("district_id", "disease_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "case_counts" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "district_id" uuid NOT NULL,
                "disease_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "cases" integer NOT NULL,
                "confirmed" integer,
                "probable" integer,
                "age_bands" jsonb,
                "version" integer NOT NULL DEFAULT '1',
                "reported_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "reported_by" uuid,
                "late" boolean NOT NULL DEFAULT false,
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "case_counts_district_disease_week_key" UNIQUE (
                    "district_id",
                    "disease_id",
                    "epi_year",
                    "epi_week"
                ),
                CONSTRAINT "case_counts_version_check" CHECK (version >= 1),
                CONSTRAINT "case_counts_week_check" CHECK (
                    epi_week BETWEEN 1 AND 53
                ),
                CONSTRAINT "case_counts_split_check" CHECK (
                    coalesce(confirmed, 0) + coalesce(probable, 0) <= cases
                ),
                CONSTRAINT "case_counts_probable_check" CHECK (
                    probable IS NULL
                    OR (
                        probable >= 0
                        AND probable <= cases
                    )
                ),
                CONSTRAINT "case_counts_confirmed_check" CHECK (
                    confirmed IS NULL
                    OR (
                        confirmed >= 0
                        AND confirmed <= cases
                    )
                ),
                CONSTRAINT "case_counts_cases_check" CHECK (cases >= 0),
                CONSTRAINT "PK_15378875e95db56789daaed2a45" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "case_counts_disease_week_idx" ON "case_counts" ("disease_id", "epi_year", "epi_week")
        `);
        await queryRunner.query(`
            CREATE TABLE "case_count_revisions" (
                "id" BIGSERIAL NOT NULL,
                "case_count_id" uuid NOT NULL,
                "version" integer NOT NULL,
                "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "actor_id" uuid,
                "kind" text NOT NULL,
                "source" text NOT NULL,
                "old_values" jsonb,
                "new_values" jsonb NOT NULL,
                "reason" text,
                CONSTRAINT "PK_10d238e1521dd97e0aea2a83541" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "case_count_revisions_count_idx" ON "case_count_revisions" ("case_count_id", "version")
        `);
        await queryRunner.query(`
            CREATE TABLE "case_district_settings" (
                "district_id" uuid NOT NULL,
                "active_from" date NOT NULL,
                CONSTRAINT "PK_072ad1aa01e1ffd1999ebb684ef" PRIMARY KEY ("district_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "case_week_closures" (
                "district_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "closed_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "closed_by" uuid,
                CONSTRAINT "case_week_closures_week_check" CHECK (
                    epi_week BETWEEN 1 AND 53
                ),
                CONSTRAINT "PK_39e106eba5021a8ddff982badc9" PRIMARY KEY ("district_id", "epi_year", "epi_week")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "larval_surveys" (
                "id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                "locality" text NOT NULL,
                "survey_date" date NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "houses_inspected" integer NOT NULL,
                "houses_positive" integer NOT NULL,
                "containers_inspected" integer NOT NULL,
                "containers_positive" integer NOT NULL,
                "pupae" integer,
                "container_types" text array NOT NULL DEFAULT '{}',
                "notes" text,
                "submitted_by" uuid,
                "submitted_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "larval_surveys_containers_check" CHECK (containers_positive <= containers_inspected),
                CONSTRAINT "larval_surveys_houses_check" CHECK (houses_positive <= houses_inspected),
                CONSTRAINT "larval_surveys_counts_check" CHECK (
                    houses_inspected >= 0
                    AND houses_positive >= 0
                    AND containers_inspected >= 0
                    AND containers_positive >= 0
                    AND (
                        pupae IS NULL
                        OR pupae >= 0
                    )
                ),
                CONSTRAINT "PK_2c3f2a16c6baae888cc249483c5" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "larval_surveys_district_week_idx" ON "larval_surveys" ("district_id", "epi_year", "epi_week")
        `);
        // The base catalogue of diseases (reference data, not demo data): an admin adds more through the API.
        await queryRunner.query(`
            INSERT INTO "diseases" ("code", "name", "profile_ids") VALUES
                ('DENV', 'Dengue', '{aedes-aegypti-dengue,aedes-albopictus-dengue}'),
                ('MAL-PV', 'Malaria (Plasmodium vivax)', '{anopheles-vivax}'),
                ('MAL-PF', 'Malaria (Plasmodium falciparum)', '{anopheles-falciparum}'),
                ('WNV', 'West Nile virus disease', '{culex-wnv}')
        `);
        await queryRunner.query(`
            ALTER TABLE "case_channel_settings"
            ADD CONSTRAINT "FK_825bfa97aeff9bbec7f5f152006" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_channel_settings"
            ADD CONSTRAINT "FK_5a1c113796d807ddb0e4d6e8db2" FOREIGN KEY ("disease_id") REFERENCES "diseases"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts"
            ADD CONSTRAINT "FK_c8eeee3a65430560b9c33a469eb" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts"
            ADD CONSTRAINT "FK_bee61aa86f6f948c850a0600c7b" FOREIGN KEY ("disease_id") REFERENCES "diseases"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts"
            ADD CONSTRAINT "FK_649f2657df679e70d4ae38dc0ae" FOREIGN KEY ("reported_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_count_revisions"
            ADD CONSTRAINT "FK_38d8cd97d7a24b748b6aa26b2c6" FOREIGN KEY ("case_count_id") REFERENCES "case_counts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_count_revisions"
            ADD CONSTRAINT "FK_6bdb61754dfdf9724041c77010a" FOREIGN KEY ("actor_id") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_district_settings"
            ADD CONSTRAINT "FK_072ad1aa01e1ffd1999ebb684ef" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_week_closures"
            ADD CONSTRAINT "FK_9e1721ba50ef305ec8b097ecac2" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "case_week_closures"
            ADD CONSTRAINT "FK_b6d62deada1ca236e7354cafb8d" FOREIGN KEY ("closed_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "larval_surveys"
            ADD CONSTRAINT "FK_e4a2ae0a34373aad114327745a2" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "larval_surveys"
            ADD CONSTRAINT "FK_a19abd10e40a2a7ac583b35e296" FOREIGN KEY ("submitted_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "larval_surveys" DROP CONSTRAINT "FK_a19abd10e40a2a7ac583b35e296"
        `);
        await queryRunner.query(`
            ALTER TABLE "larval_surveys" DROP CONSTRAINT "FK_e4a2ae0a34373aad114327745a2"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_week_closures" DROP CONSTRAINT "FK_b6d62deada1ca236e7354cafb8d"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_week_closures" DROP CONSTRAINT "FK_9e1721ba50ef305ec8b097ecac2"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_district_settings" DROP CONSTRAINT "FK_072ad1aa01e1ffd1999ebb684ef"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_count_revisions" DROP CONSTRAINT "FK_6bdb61754dfdf9724041c77010a"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_count_revisions" DROP CONSTRAINT "FK_38d8cd97d7a24b748b6aa26b2c6"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts" DROP CONSTRAINT "FK_649f2657df679e70d4ae38dc0ae"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts" DROP CONSTRAINT "FK_bee61aa86f6f948c850a0600c7b"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_counts" DROP CONSTRAINT "FK_c8eeee3a65430560b9c33a469eb"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_channel_settings" DROP CONSTRAINT "FK_5a1c113796d807ddb0e4d6e8db2"
        `);
        await queryRunner.query(`
            ALTER TABLE "case_channel_settings" DROP CONSTRAINT "FK_825bfa97aeff9bbec7f5f152006"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."larval_surveys_district_week_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "larval_surveys"
        `);
        await queryRunner.query(`
            DROP TABLE "case_week_closures"
        `);
        await queryRunner.query(`
            DROP TABLE "case_district_settings"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."case_count_revisions_count_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "case_count_revisions"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."case_counts_disease_week_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "case_counts"
        `);
        await queryRunner.query(`
            DROP TABLE "case_channel_settings"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."diseases_code_key"
        `);
        await queryRunner.query(`
            DROP TABLE "diseases"
        `);
    }

}
