import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * The week and the diseases of a tier's case count: `cases_this_week` is the count of the newest
 * complete week (its reporting deadline passed or it was closed), so the Ladder names that week and
 * those diseases instead of the tier's own (still open) week. Rows written before stay null.
 */
export class TierCasesWeek1796600300000 implements MigrationInterface {
    name = 'TierCasesWeek1796600300000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "district_tiers"
            ADD "cases_epi_year" integer
        `);
        await queryRunner.query(`
            ALTER TABLE "district_tiers"
            ADD "cases_epi_week" integer
        `);
        await queryRunner.query(`
            ALTER TABLE "district_tiers"
            ADD "cases_disease_ids" uuid array
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "district_tiers" DROP COLUMN "cases_disease_ids"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_tiers" DROP COLUMN "cases_epi_week"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_tiers" DROP COLUMN "cases_epi_year"
        `);
    }

}
