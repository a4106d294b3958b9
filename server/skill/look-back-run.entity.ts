import type { RunWarning } from '../../shared/api/problems.schema';
import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UserEntity } from '../users/user.entity';

export type LookBackRunStatus = 'running' | 'succeeded' | 'failed';

/**
 * One Look-back: the replay of a span of past seasons (epidemiological years `fromYear`…`toYear`),
 * how far it got, who started it and what it warned about (docs/skill.md).
 */
@Entity({ name: 'look_back_runs' })
@Index('look_back_runs_started_idx', ['startedAt'])
@Check('look_back_runs_status_check', "status IN ('running', 'succeeded', 'failed')")
@Check('look_back_runs_years_check', 'from_year <= to_year')
export class LookBackRunEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'from_year', type: 'integer' })
  fromYear: number;

  @Column({ name: 'to_year', type: 'integer' })
  toYear: number;

  @Column({ type: 'text' })
  status: LookBackRunStatus;

  @Column({ name: 'districts_total', type: 'integer', default: 0 })
  districtsTotal: number;

  @Column({ name: 'districts_done', type: 'integer', default: 0 })
  districtsDone: number;

  @Column({ name: 'weeks_written', type: 'integer', default: 0 })
  weeksWritten: number;

  @Column({ name: 'requested_by', type: 'uuid', nullable: true })
  requestedBy: string | null;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt: Date | null;

  /** Codes with parameters (shared/api/problems.schema.ts), worded by the Look-back screen. */
  @Column({ type: 'jsonb', default: () => "'[]'" })
  warnings: RunWarning[];

  /** Why the run as a whole stopped: a code (`interrupted` or an error's reason code). */
  @Column({ type: 'text', nullable: true })
  error: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'requested_by' })
  requester?: UserEntity;
}
