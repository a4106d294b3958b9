import type { RunWarning } from '../../shared/api/problems.schema';
import { Check, Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type SeasonRunStatus = 'running' | 'succeeded' | 'failed';

/** One season run: when, how far it got, what it wrote and what it warned about. */
@Entity({ name: 'season_runs' })
@Index('season_runs_started_idx', ['startedAt'])
@Check('season_runs_status_check', "status IN ('running', 'succeeded', 'failed')")
@Check('season_runs_kind_check', "kind IN ('nightly', 'manual')")
export class SeasonRunEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  kind: 'nightly' | 'manual';

  /** Full recomputation, or only districts whose inputs changed since the last good run. */
  @Column({ type: 'boolean', default: false })
  full: boolean;

  @Column({ type: 'text' })
  status: SeasonRunStatus;

  @Column({ name: 'requested_by', type: 'uuid', nullable: true })
  requestedBy: string | null;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt: Date | null;

  /** The day the run computed up to (inclusive). */
  @Column({ name: 'as_of', type: 'date' })
  asOf: string;

  @Column({ name: 'districts_total', type: 'integer', default: 0 })
  districtsTotal: number;

  @Column({ name: 'districts_done', type: 'integer', default: 0 })
  districtsDone: number;

  @Column({ name: 'districts_skipped', type: 'integer', default: 0 })
  districtsSkipped: number;

  @Column({ name: 'rows_written', type: 'integer', default: 0 })
  rowsWritten: number;

  @Column({ type: 'jsonb', default: () => "'[]'" })
  /** Codes with parameters (shared/api/problems.schema.ts), worded by the Season runs screen. */
  warnings: RunWarning[];

  /** How many warnings the run raised in all; `warnings` keeps at most WARNINGS_KEPT of them. */
  @Column({ name: 'warnings_total', type: 'integer', default: 0 })
  warningsTotal: number;

  /** Why the run as a whole stopped: a code (`interrupted`, `drill_stopped`, or an error's reason code). */
  @Column({ type: 'text', nullable: true })
  error: string | null;
}
