import { MigrationInterface, QueryRunner } from "typeorm";

export class TierComputedAtIndex1796194567806 implements MigrationInterface {
    name = 'TierComputedAtIndex1796194567806'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE INDEX "district_tiers_computed_at_idx" ON "district_tiers" ("computed_at")
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            DROP INDEX "public"."district_tiers_computed_at_idx"
        `);
    }

}
