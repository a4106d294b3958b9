// Reviewed: each user's language and display units (text with CHECKs, defaults en / C / mm, so existing
// accounts read as before), and bulletin_translations (one row per bulletin and non-default language,
// cascading with its bulletin; the outbox attaches the PDF of the mail's Content-Language).
import { MigrationInterface, QueryRunner } from "typeorm";

export class Preferences1796193003506 implements MigrationInterface {
    name = 'Preferences1796193003506'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "bulletin_translations" (
                "bulletin_id" uuid NOT NULL,
                "language" text NOT NULL,
                "subject" text NOT NULL,
                "html" text NOT NULL,
                "text" text NOT NULL,
                "pdf" bytea NOT NULL,
                CONSTRAINT "bulletin_translations_language_check" CHECK (language IN ('en', 'fr', 'es', 'pt')),
                CONSTRAINT "PK_7229b9dcd9062de54a2d0a8fdaf" PRIMARY KEY ("bulletin_id", "language")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "language" text NOT NULL DEFAULT 'en'
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "temperature_unit" text NOT NULL DEFAULT 'C'
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "rain_unit" text NOT NULL DEFAULT 'mm'
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD CONSTRAINT "users_rain_unit_check" CHECK (rain_unit IN ('mm', 'in'))
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD CONSTRAINT "users_temperature_unit_check" CHECK (temperature_unit IN ('C', 'F'))
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD CONSTRAINT "users_language_check" CHECK (language IN ('en', 'fr', 'es', 'pt'))
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletin_translations"
            ADD CONSTRAINT "FK_2c38741750daad99194627eba26" FOREIGN KEY ("bulletin_id") REFERENCES "bulletins"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "bulletin_translations" DROP CONSTRAINT "FK_2c38741750daad99194627eba26"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP CONSTRAINT "users_language_check"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP CONSTRAINT "users_temperature_unit_check"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP CONSTRAINT "users_rain_unit_check"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "rain_unit"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "temperature_unit"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "language"
        `);
        await queryRunner.query(`
            DROP TABLE "bulletin_translations"
        `);
    }

}
