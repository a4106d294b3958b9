import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { TierSettings } from '../../shared/tier';

/** Every version of the tier weights and cut points, newest in force, each with who and why. */
@Entity({ name: 'tier_settings_versions' })
export class TierSettingsVersionEntity {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'jsonb' })
  settings: TierSettings;

  @Column({ name: 'changed_by', type: 'uuid', nullable: true })
  changedBy: string | null;

  @Column({ type: 'text' })
  reason: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
