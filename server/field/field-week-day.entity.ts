import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { FieldTeamEntity } from './field-team.entity';
import { FieldWeekEntity } from './field-week.entity';

/** One team's one day of a Field week: the district it works in (one district a day). */
@Entity({ name: 'field_week_days' })
@Index('field_week_days_district_idx', ['districtId', 'day'])
export class FieldWeekDayEntity {
  @PrimaryColumn({ name: 'field_week_id', type: 'uuid' })
  fieldWeekId: string;

  @PrimaryColumn({ name: 'team_id', type: 'uuid' })
  teamId: string;

  @PrimaryColumn({ type: 'date' })
  day: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @ManyToOne(() => FieldWeekEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'field_week_id', foreignKeyConstraintName: 'field_week_days_field_week_id_fkey' })
  fieldWeek?: FieldWeekEntity;

  @ManyToOne(() => FieldTeamEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'team_id', foreignKeyConstraintName: 'field_week_days_team_id_fkey' })
  team?: FieldTeamEntity;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id', foreignKeyConstraintName: 'field_week_days_district_id_fkey' })
  district?: DistrictEntity;
}
