import { Check, Column, Entity, PrimaryColumn } from 'typeorm';

/**
 * The Field week's settings: one row (id 1). When `approval_required` is on, publishing a week sends it to
 * the supervisors first; members are mailed once a supervisor approves it. Every change is an audit event.
 */
@Entity({ name: 'field_settings' })
@Check('field_settings_single_row', 'id = 1')
export class FieldSettingsEntity {
  @PrimaryColumn({ type: 'smallint', default: 1, primaryKeyConstraintName: 'field_settings_pkey' })
  id: number;

  @Column({ name: 'approval_required', type: 'boolean', default: false })
  approvalRequired: boolean;

  @Column({ name: 'updated_by', type: 'uuid', nullable: true })
  updatedBy: string | null;

  @Column({ name: 'updated_at', type: 'timestamptz', nullable: true })
  updatedAt: Date | null;
}
