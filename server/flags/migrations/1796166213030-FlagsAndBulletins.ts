// Reviewed: flags (one open per district and reason: partial unique index; sign-off by conditional UPDATE on
// status and version), advisories (one per flag), subscriptions (user × district, kinds checked), bulletins
// (one per district and week, PDF kept once), outbox_messages (due index on status, next_attempt_at; unique
// Message-ID) and outbox_attempts (delivery log). FKs cascade from districts; people's ids are SET NULL.
import { MigrationInterface, QueryRunner } from "typeorm";

export class FlagsAndBulletins1796166213030 implements MigrationInterface {
    name = 'FlagsAndBulletins1796166213030'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "flags" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "district_id" uuid NOT NULL,
                "reason" text NOT NULL,
                "source" text NOT NULL,
                "status" text NOT NULL DEFAULT 'open',
                "tier" text,
                "previous_tier" text,
                "epi_year" integer,
                "epi_week" integer,
                "run_id" uuid,
                "drivers" jsonb NOT NULL,
                "suggested_message" text NOT NULL,
                "actions" jsonb NOT NULL,
                "note" text,
                "raised_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "decided_by" uuid,
                "decided_at" TIMESTAMP WITH TIME ZONE,
                "decision_reason" text,
                "final_message" text,
                "version" integer NOT NULL DEFAULT '1',
                CONSTRAINT "flags_decision_check" CHECK ((status = 'open') = (decided_at IS NULL)),
                CONSTRAINT "flags_status_check" CHECK (status IN ('open', 'approved', 'rejected')),
                CONSTRAINT "flags_source_check" CHECK (source IN ('season-run', 'manual')),
                CONSTRAINT "flags_reason_check" CHECK (
                    reason IN (
                        'tier-rise',
                        'channel-above',
                        'case-alarm',
                        'manual'
                    )
                ),
                CONSTRAINT "PK_ea7e333c92a55de9e9b8d0b9afd" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "flags_open_key" ON "flags" ("district_id", "reason")
            WHERE status = 'open'
        `);
        await queryRunner.query(`
            CREATE INDEX "flags_district_idx" ON "flags" ("district_id", "created_at")
        `);
        await queryRunner.query(`
            CREATE INDEX "flags_status_created_idx" ON "flags" ("status", "created_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "advisories" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "flag_id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                "tier" text,
                "message" text NOT NULL,
                "actions" jsonb NOT NULL,
                "issued_by" uuid,
                "issued_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "PK_d7296456a2d94b0ec905412c5b2" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "advisories_flag_key" ON "advisories" ("flag_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "advisories_district_idx" ON "advisories" ("district_id", "issued_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "bulletins" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "district_id" uuid NOT NULL,
                "epi_year" integer NOT NULL,
                "epi_week" integer NOT NULL,
                "subject" text NOT NULL,
                "html" text NOT NULL,
                "text" text NOT NULL,
                "pdf" bytea NOT NULL,
                "created_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_2a8a95dd56d5a3507074c35954e" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "bulletins_district_week_key" ON "bulletins" ("district_id", "epi_year", "epi_week")
        `);
        await queryRunner.query(`
            CREATE TABLE "subscriptions" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                "kinds" text array NOT NULL,
                "active" boolean NOT NULL DEFAULT true,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "subscriptions_kinds_check" CHECK (kinds <@ ARRAY ['advisory', 'bulletin']::text []),
                CONSTRAINT "PK_a87248d73155605cf782be9ee5e" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "subscriptions_district_idx" ON "subscriptions" ("district_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "subscriptions_user_district_key" ON "subscriptions" ("user_id", "district_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "outbox_messages" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "kind" text NOT NULL,
                "message_id" text NOT NULL,
                "to_address" text NOT NULL,
                "user_id" uuid,
                "subject" text NOT NULL,
                "text_body" text NOT NULL,
                "html_body" text NOT NULL,
                "headers" jsonb NOT NULL DEFAULT '{}',
                "bulletin_id" uuid,
                "advisory_id" uuid,
                "status" text NOT NULL DEFAULT 'pending',
                "attempts" integer NOT NULL DEFAULT '0',
                "next_attempt_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "last_error" text,
                "sent_at" TIMESTAMP WITH TIME ZONE,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "outbox_messages_status_check" CHECK (status IN ('pending', 'sent', 'failed')),
                CONSTRAINT "outbox_messages_kind_check" CHECK (
                    kind IN (
                        'advisory',
                        'bulletin',
                        'invite',
                        'password-reset'
                    )
                ),
                CONSTRAINT "PK_0171348f527c64b137e4d4f5b66" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "outbox_messages_message_id_key" ON "outbox_messages" ("message_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "outbox_messages_created_idx" ON "outbox_messages" ("created_at")
        `);
        await queryRunner.query(`
            CREATE INDEX "outbox_messages_due_idx" ON "outbox_messages" ("status", "next_attempt_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "outbox_attempts" (
                "id" BIGSERIAL NOT NULL,
                "message_id" uuid NOT NULL,
                "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "outcome" text NOT NULL,
                "error" text,
                "duration_ms" integer NOT NULL,
                CONSTRAINT "outbox_attempts_outcome_check" CHECK (outcome IN ('sent', 'retry', 'failed')),
                CONSTRAINT "PK_e35a1f86fb21f9c97644a01b1f1" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "outbox_attempts_message_idx" ON "outbox_attempts" ("message_id", "at")
        `);
        await queryRunner.query(`
            ALTER TABLE "flags"
            ADD CONSTRAINT "FK_94ac650eadb6b9afb1617bd5423" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "flags"
            ADD CONSTRAINT "FK_44a3564d80a6b7a95623b546d37" FOREIGN KEY ("raised_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "flags"
            ADD CONSTRAINT "FK_a0752ff5f7db0366634b9a95949" FOREIGN KEY ("decided_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories"
            ADD CONSTRAINT "FK_077ee2a624740ca3ebd03aaf754" FOREIGN KEY ("flag_id") REFERENCES "flags"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories"
            ADD CONSTRAINT "FK_0f0041878c6127eb3d5c8ac1715" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories"
            ADD CONSTRAINT "FK_d0528667155f850766f22fb4e98" FOREIGN KEY ("issued_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletins"
            ADD CONSTRAINT "FK_f46723d84bb31f8227d2eb47049" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletins"
            ADD CONSTRAINT "FK_80b3bba54b24b6e1f143c9c9cab" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "subscriptions"
            ADD CONSTRAINT "FK_d0a95ef8a28188364c546eb65c1" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "subscriptions"
            ADD CONSTRAINT "FK_387feac13007714561ae728a33a" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages"
            ADD CONSTRAINT "FK_2da2b5a8ebd90e1ad73b785f9ef" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages"
            ADD CONSTRAINT "FK_05ec6952d802e193e94084850c6" FOREIGN KEY ("bulletin_id") REFERENCES "bulletins"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages"
            ADD CONSTRAINT "FK_11a108faad2845f80b4c5c8f61e" FOREIGN KEY ("advisory_id") REFERENCES "advisories"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_attempts"
            ADD CONSTRAINT "FK_9fcb9f250383f6cb50d1a5ef120" FOREIGN KEY ("message_id") REFERENCES "outbox_messages"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "outbox_attempts" DROP CONSTRAINT "FK_9fcb9f250383f6cb50d1a5ef120"
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" DROP CONSTRAINT "FK_11a108faad2845f80b4c5c8f61e"
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" DROP CONSTRAINT "FK_05ec6952d802e193e94084850c6"
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_messages" DROP CONSTRAINT "FK_2da2b5a8ebd90e1ad73b785f9ef"
        `);
        await queryRunner.query(`
            ALTER TABLE "subscriptions" DROP CONSTRAINT "FK_387feac13007714561ae728a33a"
        `);
        await queryRunner.query(`
            ALTER TABLE "subscriptions" DROP CONSTRAINT "FK_d0a95ef8a28188364c546eb65c1"
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletins" DROP CONSTRAINT "FK_80b3bba54b24b6e1f143c9c9cab"
        `);
        await queryRunner.query(`
            ALTER TABLE "bulletins" DROP CONSTRAINT "FK_f46723d84bb31f8227d2eb47049"
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories" DROP CONSTRAINT "FK_d0528667155f850766f22fb4e98"
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories" DROP CONSTRAINT "FK_0f0041878c6127eb3d5c8ac1715"
        `);
        await queryRunner.query(`
            ALTER TABLE "advisories" DROP CONSTRAINT "FK_077ee2a624740ca3ebd03aaf754"
        `);
        await queryRunner.query(`
            ALTER TABLE "flags" DROP CONSTRAINT "FK_a0752ff5f7db0366634b9a95949"
        `);
        await queryRunner.query(`
            ALTER TABLE "flags" DROP CONSTRAINT "FK_44a3564d80a6b7a95623b546d37"
        `);
        await queryRunner.query(`
            ALTER TABLE "flags" DROP CONSTRAINT "FK_94ac650eadb6b9afb1617bd5423"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."outbox_attempts_message_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "outbox_attempts"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."outbox_messages_due_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."outbox_messages_created_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."outbox_messages_message_id_key"
        `);
        await queryRunner.query(`
            DROP TABLE "outbox_messages"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."subscriptions_user_district_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."subscriptions_district_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "subscriptions"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."bulletins_district_week_key"
        `);
        await queryRunner.query(`
            DROP TABLE "bulletins"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."advisories_district_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."advisories_flag_key"
        `);
        await queryRunner.query(`
            DROP TABLE "advisories"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."flags_status_created_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."flags_district_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."flags_open_key"
        `);
        await queryRunner.query(`
            DROP TABLE "flags"
        `);
    }

}
