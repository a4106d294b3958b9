// Reviewed: local profile variants (a copy of a published profile with sourced changes), and who assigned
// each district's profile and when. Nullable columns: the demo seed and older rows have no assigner.
import { MigrationInterface, QueryRunner } from "typeorm";

export class ProfileVariants1796300000000 implements MigrationInterface {
    name = 'ProfileVariants1796300000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "profile_variants" (
                "id" text NOT NULL,
                "base_profile_id" text NOT NULL,
                "name" text NOT NULL,
                "profile" jsonb NOT NULL,
                "changes" jsonb NOT NULL,
                "created_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_profile_variants" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "district_profiles" ADD "assigned_by" uuid
        `);
        await queryRunner.query(`
            ALTER TABLE "district_profiles" ADD "assigned_at" TIMESTAMP WITH TIME ZONE
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "district_profiles" DROP COLUMN "assigned_at"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_profiles" DROP COLUMN "assigned_by"
        `);
        await queryRunner.query(`
            DROP TABLE "profile_variants"
        `);
    }

}
