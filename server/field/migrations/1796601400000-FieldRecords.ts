// Reviewed (issue 19, item 3): field records, one row per piece of work a team member recorded. The id is
// the browser's (the offline queue's idempotency key, as for larval surveys). Optional coverage, product
// and notes are NULL when not given. Constraint names are given in the entity, so the check finds no drift.
import { MigrationInterface, QueryRunner } from "typeorm";

export class FieldRecords1796601400000 implements MigrationInterface {
    name = 'FieldRecords1796601400000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "field_records" (
                "id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                "locality" text NOT NULL,
                "work_date" date NOT NULL,
                "kind" text NOT NULL,
                "houses_visited" integer,
                "containers" integer,
                "area_m2" double precision,
                "product" text,
                "amount" double precision,
                "amount_unit" text,
                "notes" text,
                "submitted_by" uuid,
                "submitted_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "field_records_kind_check" CHECK (kind IN ('source-reduction', 'larviciding', 'indoor-residual-spraying', 'space-spraying', 'case-investigation', 'community-clean-up', 'health-education')),
                CONSTRAINT "field_records_coverage_check" CHECK ((houses_visited IS NULL OR houses_visited >= 0) AND (containers IS NULL OR containers >= 0) AND (area_m2 IS NULL OR area_m2 >= 0)),
                CONSTRAINT "field_records_amount_check" CHECK ((amount IS NULL OR (amount > 0 AND amount_unit IS NOT NULL))),
                CONSTRAINT "field_records_unit_check" CHECK (amount_unit IS NULL OR amount_unit IN ('ml', 'l', 'g', 'kg')),
                CONSTRAINT "field_records_pkey" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`CREATE INDEX "field_records_district_date_idx" ON "field_records" ("district_id", "work_date")`);
        await queryRunner.query(`CREATE INDEX "field_records_date_idx" ON "field_records" ("work_date")`);
        await queryRunner.query(`
            ALTER TABLE "field_records"
            ADD CONSTRAINT "field_records_district_id_fkey" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_records"
            ADD CONSTRAINT "field_records_submitted_by_fkey" FOREIGN KEY ("submitted_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "field_records" DROP CONSTRAINT "field_records_submitted_by_fkey"`);
        await queryRunner.query(`ALTER TABLE "field_records" DROP CONSTRAINT "field_records_district_id_fkey"`);
        await queryRunner.query(`DROP INDEX "public"."field_records_date_idx"`);
        await queryRunner.query(`DROP INDEX "public"."field_records_district_date_idx"`);
        await queryRunner.query(`DROP TABLE "field_records"`);
    }
}
