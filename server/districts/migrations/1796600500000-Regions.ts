// Reviewed (issue 17): regions, one level above the district; a district's region (nullable: the demo and
// districts created one by one have none); the display boundary simplified at import beside the full one;
// users scoped to regions. Constraint names are given in the entities, so the check finds no drift.
import { MigrationInterface, QueryRunner } from "typeorm";

export class Regions1796600500000 implements MigrationInterface {
    name = 'Regions1796600500000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "regions" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "code" text NOT NULL,
                "name" text NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_4fcd12ed6a046276e2deb08801c" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`CREATE UNIQUE INDEX "regions_code_key" ON "regions" ("code")`);
        await queryRunner.query(`ALTER TABLE "districts" ADD "display_boundary" jsonb`);
        await queryRunner.query(`ALTER TABLE "districts" ADD "region_id" uuid`);
        await queryRunner.query(`CREATE INDEX "districts_region_idx" ON "districts" ("region_id")`);
        await queryRunner.query(`
            ALTER TABLE "districts" ADD CONSTRAINT "districts_region_id_fkey" FOREIGN KEY ("region_id")
            REFERENCES "regions"("id") ON DELETE SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            CREATE TABLE "user_regions" (
                "user_id" uuid NOT NULL,
                "region_id" uuid NOT NULL,
                CONSTRAINT "PK_fddee0c19031c8a5f6eaa8c6eab" PRIMARY KEY ("user_id", "region_id")
            )
        `);
        await queryRunner.query(`CREATE INDEX "user_regions_region_idx" ON "user_regions" ("region_id")`);
        await queryRunner.query(`
            ALTER TABLE "user_regions" ADD CONSTRAINT "user_regions_user_id_fkey" FOREIGN KEY ("user_id")
            REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_regions" ADD CONSTRAINT "user_regions_region_id_fkey" FOREIGN KEY ("region_id")
            REFERENCES "regions"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TABLE "user_regions"`);
        await queryRunner.query(`ALTER TABLE "districts" DROP CONSTRAINT "districts_region_id_fkey"`);
        await queryRunner.query(`DROP INDEX "districts_region_idx"`);
        await queryRunner.query(`ALTER TABLE "districts" DROP COLUMN "region_id"`);
        await queryRunner.query(`ALTER TABLE "districts" DROP COLUMN "display_boundary"`);
        await queryRunner.query(`DROP TABLE "regions"`);
    }
}
