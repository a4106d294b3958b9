import type { FieldSettingsBody, FieldSettingsDto } from '../../shared/api/field.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';

/** The Field week's settings (whether a supervisor must approve the plan before it is published), read and changed by an admin. */
export class FieldSettingsService {
  constructor(private readonly ctx: AppContext) {}

  async get(): Promise<FieldSettingsDto> {
    const [row] = await this.ctx.ds.query(
      `SELECT s.approval_required, s.updated_at, s.updated_by, u.display_name FROM field_settings s LEFT JOIN users u ON u.id = s.updated_by WHERE s.id = 1`,
    );
    return row
      ? {
          approvalRequired: row.approval_required,
          updatedAt: row.updated_at ? new Date(row.updated_at).toISOString() : null,
          updatedBy: row.updated_by ? { id: row.updated_by, displayName: row.display_name ?? '' } : null,
        }
      : { approvalRequired: false, updatedAt: null, updatedBy: null };
  }

  /** One row, written with the audit event (before, after, reason) in one transaction. */
  async update(p: Principal, body: FieldSettingsBody): Promise<FieldSettingsDto> {
    await this.ctx.ds.transaction(async (manager) => {
      const [before] = await manager.query(`SELECT approval_required FROM field_settings WHERE id = 1 FOR UPDATE`);
      await manager.query(
        `INSERT INTO field_settings (id, approval_required, updated_by, updated_at) VALUES (1, $1, $2, now())
         ON CONFLICT (id) DO UPDATE SET approval_required = EXCLUDED.approval_required, updated_by = EXCLUDED.updated_by, updated_at = EXCLUDED.updated_at`,
        [body.approvalRequired, p.userId],
      );
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-settings.updated', entity: 'field-settings', entityId: '1',
        before: { approvalRequired: before?.approval_required ?? false }, after: { approvalRequired: body.approvalRequired }, reason: body.reason,
      });
    });
    return this.get();
  }
}
