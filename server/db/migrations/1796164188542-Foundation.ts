// Reviewed: users, districts with populations and GeoJSON boundaries, sessions, one-time tokens
// (invite / reset, hashed), audit trail. Foreign keys cascade from users and districts.
import { MigrationInterface, QueryRunner } from "typeorm";

export class Foundation1796164188542 implements MigrationInterface {
    name = 'Foundation1796164188542'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "audit_events" (
                "id" BIGSERIAL NOT NULL,
                "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "actor_id" uuid,
                "action" text NOT NULL,
                "entity" text NOT NULL,
                "entity_id" text NOT NULL,
                "before" jsonb,
                "after" jsonb,
                "reason" text,
                CONSTRAINT "PK_910f64d901a5c3e9878f0d4a407" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "audit_events_entity_idx" ON "audit_events" ("entity", "entity_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "users" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "email" text NOT NULL,
                "display_name" text NOT NULL,
                "role" text NOT NULL,
                "password_hash" text,
                "active" boolean NOT NULL DEFAULT true,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "users_role_check" CHECK (
                    role IN (
                        'admin',
                        'officer',
                        'epidemiologist',
                        'supervisor',
                        'worker'
                    )
                ),
                CONSTRAINT "PK_a3ffb1c0c8416b9fc6f907b7433" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "users_email_key" ON "users" ("email")
        `);
        await queryRunner.query(`
            CREATE TABLE "one_time_tokens" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "purpose" text NOT NULL,
                "token_hash" text NOT NULL,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "used_at" TIMESTAMP WITH TIME ZONE,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "one_time_tokens_purpose_check" CHECK (purpose IN ('invite', 'password-reset')),
                CONSTRAINT "PK_8e470cc9ffc1b2afa054304db17" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "one_time_tokens_hash_key" ON "one_time_tokens" ("token_hash")
        `);
        await queryRunner.query(`
            CREATE TABLE "sessions" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "revoked_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_3238ef96f18b355b671619111bc" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "sessions_user_idx" ON "sessions" ("user_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "districts" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "code" text NOT NULL,
                "name" text NOT NULL,
                "is_demo" boolean NOT NULL DEFAULT false,
                "boundary" jsonb,
                "centroid_lat" double precision,
                "centroid_lon" double precision,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_972a72ff4e3bea5c7f43a2b98af" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "districts_code_key" ON "districts" ("code")
        `);
        await queryRunner.query(`
            CREATE TABLE "district_populations" (
                "district_id" uuid NOT NULL,
                "year" integer NOT NULL,
                "population" integer NOT NULL,
                CONSTRAINT "district_populations_population_check" CHECK (population >= 0),
                CONSTRAINT "PK_f7e3f2bdca4926f00df7b70dcc8" PRIMARY KEY ("district_id", "year")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "user_districts" (
                "user_id" uuid NOT NULL,
                "district_id" uuid NOT NULL,
                CONSTRAINT "PK_8c438ba258378ce381d093c255d" PRIMARY KEY ("user_id", "district_id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "user_districts_district_idx" ON "user_districts" ("district_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "one_time_tokens"
            ADD CONSTRAINT "FK_0dc2deee64e514ad6f7e69504e1" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "sessions"
            ADD CONSTRAINT "FK_085d540d9f418cfbdc7bd55bb19" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "district_populations"
            ADD CONSTRAINT "FK_6822ff002da8b3fbf7c124d78e6" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_districts"
            ADD CONSTRAINT "FK_3776d9f273dca11ba535e197597" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_districts"
            ADD CONSTRAINT "FK_8a27c89b191cc235e932b207a75" FOREIGN KEY ("district_id") REFERENCES "districts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "user_districts" DROP CONSTRAINT "FK_8a27c89b191cc235e932b207a75"
        `);
        await queryRunner.query(`
            ALTER TABLE "user_districts" DROP CONSTRAINT "FK_3776d9f273dca11ba535e197597"
        `);
        await queryRunner.query(`
            ALTER TABLE "district_populations" DROP CONSTRAINT "FK_6822ff002da8b3fbf7c124d78e6"
        `);
        await queryRunner.query(`
            ALTER TABLE "sessions" DROP CONSTRAINT "FK_085d540d9f418cfbdc7bd55bb19"
        `);
        await queryRunner.query(`
            ALTER TABLE "one_time_tokens" DROP CONSTRAINT "FK_0dc2deee64e514ad6f7e69504e1"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."user_districts_district_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "user_districts"
        `);
        await queryRunner.query(`
            DROP TABLE "district_populations"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."districts_code_key"
        `);
        await queryRunner.query(`
            DROP TABLE "districts"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."sessions_user_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "sessions"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."one_time_tokens_hash_key"
        `);
        await queryRunner.query(`
            DROP TABLE "one_time_tokens"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."users_email_key"
        `);
        await queryRunner.query(`
            DROP TABLE "users"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."audit_events_entity_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "audit_events"
        `);
    }

}
