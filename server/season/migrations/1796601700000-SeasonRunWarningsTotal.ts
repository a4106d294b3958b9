import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * How many warnings a season run raised in all. The stored list keeps at most 1,000 of them (failed
 * districts first); the total lets the Season runs screen say how many more were not listed (issue 21).
 * Runs recorded before keep the length of their list as their total.
 */
export class SeasonRunWarningsTotal1796601700000 implements MigrationInterface {
    name = 'SeasonRunWarningsTotal1796601700000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "season_runs"
            ADD "warnings_total" integer NOT NULL DEFAULT 0
        `);
        await queryRunner.query(`
            UPDATE "season_runs" SET "warnings_total" = jsonb_array_length("warnings")
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "season_runs" DROP COLUMN "warnings_total"
        `);
    }

}
