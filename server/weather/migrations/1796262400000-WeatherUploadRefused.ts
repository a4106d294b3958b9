// Reviewed: an upload refused as a whole (a file that cannot be loaded: binary, a wrong header, a line past
// the limit, cut off) gets its own status, 'refused', with the reason as a stable code and its parameters,
// so the client words it in the reader's language; 'failed' stays for a fault on the server's side.
// Messages written before this are cut to the cap the server now applies (docs/security.md § Limits).
import { MigrationInterface, QueryRunner } from "typeorm";

export class WeatherUploadRefused1796262400000 implements MigrationInterface {
    name = 'WeatherUploadRefused1796262400000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" DROP CONSTRAINT "weather_uploads_status_check"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" ADD "reason_code" text
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" ADD "reason_params" jsonb
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads"
            ADD CONSTRAINT "weather_uploads_status_check" CHECK (status IN ('processing', 'done', 'failed', 'refused'))
        `);
        await queryRunner.query(`
            UPDATE "weather_uploads" SET "message" = left("message", 1000) || '… [cut]' WHERE length("message") > 1000
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" DROP CONSTRAINT "weather_uploads_status_check"
        `);
        await queryRunner.query(`
            UPDATE "weather_uploads" SET "status" = 'failed' WHERE "status" = 'refused'
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" DROP COLUMN "reason_params"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads" DROP COLUMN "reason_code"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_uploads"
            ADD CONSTRAINT "weather_uploads_status_check" CHECK (status IN ('processing', 'done', 'failed'))
        `);
    }
}
