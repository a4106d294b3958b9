import { Check, Column, Entity, PrimaryColumn } from 'typeorm';

/**
 * The flag settings: one row (id 1). An open flag older than `lapse_weeks` leaves the sign-off queue as
 * lapsed (docs/flags-and-bulletins.md). Every change is an audit event with its reason.
 */
@Entity({ name: 'flag_settings' })
@Check('flag_settings_single_row', 'id = 1')
@Check('flag_settings_lapse_weeks_check', 'lapse_weeks BETWEEN 1 AND 26')
export class FlagSettingsEntity {
  @PrimaryColumn({ type: 'smallint', default: 1 })
  id: number;

  @Column({ name: 'lapse_weeks', type: 'integer', default: 2 })
  lapseWeeks: number;

  @Column({ name: 'updated_by', type: 'uuid', nullable: true })
  updatedBy: string | null;

  @Column({ name: 'updated_at', type: 'timestamptz', nullable: true })
  updatedAt: Date | null;
}
