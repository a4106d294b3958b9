import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { parseFirst, timestampColumn } from '../platform/rows';

const settingsRow = z.object({
  approval_required: z.boolean(),
  updated_at: timestampColumn.nullable(),
  updated_by: z.string().nullable(),
  display_name: z.string().nullable(),
});
export type FieldSettingsRow = z.infer<typeof settingsRow>;

/** All SQL of the Field week's settings (one row, id 1). */
export class FieldSettingsRepository {
  constructor(private readonly manager: EntityManager) {}

  async get(): Promise<FieldSettingsRow | null> {
    return parseFirst(settingsRow, await this.manager.query(
      `SELECT s.approval_required, s.updated_at, s.updated_by, u.display_name FROM field_settings s LEFT JOIN users u ON u.id = s.updated_by WHERE s.id = 1`,
    ));
  }

  /** Whether approval is required, locking the row for the caller's transaction when `forUpdate`. */
  async approvalRequired(forUpdate = false): Promise<boolean | null> {
    const row = parseFirst(z.object({ approval_required: z.boolean() }), await this.manager.query(
      `SELECT approval_required FROM field_settings WHERE id = 1${forUpdate ? ' FOR UPDATE' : ''}`,
    ));
    return row ? row.approval_required : null;
  }

  async save(approvalRequired: boolean, userId: string): Promise<void> {
    await this.manager.query(
      `INSERT INTO field_settings (id, approval_required, updated_by, updated_at) VALUES (1, $1, $2, now())
       ON CONFLICT (id) DO UPDATE SET approval_required = EXCLUDED.approval_required, updated_by = EXCLUDED.updated_by, updated_at = EXCLUDED.updated_at`,
      [approvalRequired, userId],
    );
  }
}
