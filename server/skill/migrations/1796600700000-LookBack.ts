import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * The Look-back (issue 18): a run replaying past seasons and its replayed district-weeks, stored apart
 * from the live tiers. Deleting a run deletes its weeks; deleting a district deletes its replayed weeks.
 */
export class LookBack1796600700000 implements MigrationInterface {
    name = 'LookBack1796600700000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "look_back_runs" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "from_year" integer NOT NULL,
                "to_year" integer NOT NULL,
                "status" text NOT NULL,
                "districts_total" integer NOT NULL DEFAULT '0',
                "districts_done" integer NOT NULL DEFAULT '0',
                "weeks_written" integer NOT NULL DEFAULT '0',
                "requested_by" uuid,
                "started_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "finished_at" TIMESTAMP WITH TIME ZONE,
                "warnings" jsonb NOT NULL DEFAULT '[]',
                "error" text,
                CONSTRAINT "look_back_runs_years_check" CHECK (from_year <= to_year),
                CONSTRAINT "look_back_runs_status_check" CHECK (status IN ('running', 'succeeded', 'failed')),
                CONSTRAINT "PK_00429d836a07864fcd6f383bbed" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "look_back_runs_started_idx" ON "look_back_runs" ("started_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "look_back_weeks" (
                "run_id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "as_of" date NOT NULL,
                "tier" text NOT NULL,
                "score" double precision NOT NULL,
                "drivers" jsonb NOT NULL,
                CONSTRAINT "PK_19cad946b1a1c2b69dff42cd405" PRIMARY KEY ("run_id", "district_id", "epi_year", "epi_week")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "look_back_weeks_district_idx" ON "look_back_weeks" ("district_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "look_back_runs"
            ADD CONSTRAINT "FK_8d55278ebe26dbdc4272dd4838a" FOREIGN KEY ("requested_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "look_back_weeks"
            ADD CONSTRAINT "FK_1a91d7b59a4427b9402e747b601" FOREIGN KEY ("run_id") REFERENCES "look_back_runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "look_back_weeks"
            ADD CONSTRAINT "FK_f20f0151b6c0100496b9627e448" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "look_back_weeks" DROP CONSTRAINT "FK_f20f0151b6c0100496b9627e448"
        `);
        await queryRunner.query(`
            ALTER TABLE "look_back_weeks" DROP CONSTRAINT "FK_1a91d7b59a4427b9402e747b601"
        `);
        await queryRunner.query(`
            ALTER TABLE "look_back_runs" DROP CONSTRAINT "FK_8d55278ebe26dbdc4272dd4838a"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."look_back_weeks_district_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "look_back_weeks"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."look_back_runs_started_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "look_back_runs"
        `);
    }

}
