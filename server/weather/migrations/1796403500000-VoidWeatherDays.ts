import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Void, never delete (issue 14): a station-day voided as entered in error keeps its values in
 * weather_observation_revisions with kind 'void' and the reason; a replacement by a later intake is
 * kind 'replaced' (every existing row). Reviewed: written to match the entity, checked with migration:check.
 */
export class VoidWeatherDays1796403500000 implements MigrationInterface {
  name = 'VoidWeatherDays1796403500000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "weather_observation_revisions" ADD "kind" text NOT NULL DEFAULT 'replaced'`);
    await queryRunner.query(`ALTER TABLE "weather_observation_revisions" ADD "reason" text`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "weather_observation_revisions" DROP COLUMN "reason"`);
    await queryRunner.query(`ALTER TABLE "weather_observation_revisions" DROP COLUMN "kind"`);
  }
}
