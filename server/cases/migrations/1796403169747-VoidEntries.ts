import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Void, never delete (issue 14): a larval survey or a weekly case count entered in error is marked
 * voided with who, when and why. The row stays (history and audit keep it); every reader that counts
 * filters `voided_at IS NULL`. Reviewed: generated, then the unrelated weather_station_years drift removed.
 */
export class VoidEntries1796403169747 implements MigrationInterface {
  name = 'VoidEntries1796403169747';

  public async up(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['case_counts', 'larval_surveys']) {
      await queryRunner.query(`ALTER TABLE "${table}" ADD "voided_at" TIMESTAMP WITH TIME ZONE`);
      await queryRunner.query(`ALTER TABLE "${table}" ADD "voided_by" uuid`);
      await queryRunner.query(`ALTER TABLE "${table}" ADD "void_reason" text`);
      await queryRunner.query(`ALTER TABLE "${table}" ADD CONSTRAINT "${table}_void_check" CHECK ((voided_at IS NULL) = (void_reason IS NULL))`);
    }
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['larval_surveys', 'case_counts']) {
      await queryRunner.query(`ALTER TABLE "${table}" DROP CONSTRAINT "${table}_void_check"`);
      await queryRunner.query(`ALTER TABLE "${table}" DROP COLUMN "void_reason"`);
      await queryRunner.query(`ALTER TABLE "${table}" DROP COLUMN "voided_by"`);
      await queryRunner.query(`ALTER TABLE "${table}" DROP COLUMN "voided_at"`);
    }
  }
}
