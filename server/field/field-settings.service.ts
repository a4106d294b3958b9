import type { FieldSettingsBody, FieldSettingsDto } from '../../shared/api/field.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { FieldSettingsRepository } from './field-settings.repository';

/** The Field week's settings (whether a supervisor must approve the plan before it is published), read and changed by an admin. */
export class FieldSettingsService {
  constructor(private readonly ctx: AppContext) {}

  async get(): Promise<FieldSettingsDto> {
    const row = await new FieldSettingsRepository(this.ctx.ds.manager).get();
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
      const settings = new FieldSettingsRepository(manager);
      const before = await settings.approvalRequired(true);
      await settings.save(body.approvalRequired, p.userId);
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-settings.updated', entity: 'field-settings', entityId: '1',
        before: { approvalRequired: before ?? false }, after: { approvalRequired: body.approvalRequired }, reason: body.reason,
      });
    });
    return this.get();
  }
}
