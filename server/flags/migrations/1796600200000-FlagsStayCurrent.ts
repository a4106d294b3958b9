// Reviewed (issue 16 items 3–4): flags keep their suggested message as a code and the numbers it is worded
// from (message_code, message_params; the English suggested_message stays for the record), a hand-raised
// flag's public message apart from its internal note (public_message), and a `lapsed` status (an open flag
// older than the flag settings, stored only when a newer flag of its district and reason is raised; the
// partial unique index flags_open_key stays on status = 'open'). Advisories keep their message the same way.
// flag_settings: one row (id 1) with the lapse in weeks (default 2), written by the admin, audited.
// Existing rows keep NULL codes: their messages are composed again from their stored drivers on read.
import { MigrationInterface, QueryRunner } from "typeorm";

const CODES = `'diapause', 'zero-suitability', 'no-signal', 'case-signal-only', 'case-led', 'weather-led', 'larval-led', 'mixed', 'custom'`;

export class FlagsStayCurrent1796600200000 implements MigrationInterface {
    name = 'FlagsStayCurrent1796600200000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "flags" ADD "message_code" text`);
        await queryRunner.query(`ALTER TABLE "flags" ADD "message_params" jsonb`);
        await queryRunner.query(`ALTER TABLE "flags" ADD "public_message" text`);
        await queryRunner.query(`ALTER TABLE "flags" DROP CONSTRAINT "flags_status_check"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP CONSTRAINT "flags_decision_check"`);
        await queryRunner.query(`ALTER TABLE "flags" ADD CONSTRAINT "flags_status_check" CHECK (status IN ('open', 'lapsed', 'approved', 'rejected'))`);
        await queryRunner.query(`ALTER TABLE "flags" ADD CONSTRAINT "flags_decision_check" CHECK ((status IN ('open', 'lapsed')) = (decided_at IS NULL))`);
        await queryRunner.query(`ALTER TABLE "flags" ADD CONSTRAINT "flags_message_code_check" CHECK (message_code IS NULL OR message_code IN (${CODES}))`);
        await queryRunner.query(`ALTER TABLE "advisories" ADD "message_code" text`);
        await queryRunner.query(`ALTER TABLE "advisories" ADD "message_params" jsonb`);
        await queryRunner.query(`ALTER TABLE "advisories" ADD CONSTRAINT "advisories_message_code_check" CHECK (message_code IS NULL OR message_code IN (${CODES}))`);
        await queryRunner.query(`
            CREATE TABLE "flag_settings" (
                "id" smallint NOT NULL DEFAULT '1',
                "lapse_weeks" integer NOT NULL DEFAULT '2',
                "updated_by" uuid,
                "updated_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "flag_settings_lapse_weeks_check" CHECK (lapse_weeks BETWEEN 1 AND 26),
                CONSTRAINT "flag_settings_single_row" CHECK (id = 1),
                CONSTRAINT "PK_9846fc5e23465adffbf2a132274" PRIMARY KEY ("id")
            )
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TABLE "flag_settings"`);
        await queryRunner.query(`ALTER TABLE "advisories" DROP CONSTRAINT "advisories_message_code_check"`);
        await queryRunner.query(`ALTER TABLE "advisories" DROP COLUMN "message_params"`);
        await queryRunner.query(`ALTER TABLE "advisories" DROP COLUMN "message_code"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP CONSTRAINT "flags_message_code_check"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP CONSTRAINT "flags_decision_check"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP CONSTRAINT "flags_status_check"`);
        // The older statuses knew no lapse: a lapsed flag is recorded as rejected (reopening it could meet a newer open flag).
        await queryRunner.query(`UPDATE "flags" SET status = 'rejected', decided_at = now(), decision_reason = 'lapsed' WHERE status = 'lapsed'`);
        await queryRunner.query(`ALTER TABLE "flags" ADD CONSTRAINT "flags_decision_check" CHECK ((status = 'open') = (decided_at IS NULL))`);
        await queryRunner.query(`ALTER TABLE "flags" ADD CONSTRAINT "flags_status_check" CHECK (status IN ('open', 'approved', 'rejected'))`);
        await queryRunner.query(`ALTER TABLE "flags" DROP COLUMN "public_message"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP COLUMN "message_params"`);
        await queryRunner.query(`ALTER TABLE "flags" DROP COLUMN "message_code"`);
    }
}
