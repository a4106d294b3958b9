import { Check, Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** done: loaded; refused: the file cannot be loaded (reasonCode says why); failed: a fault on the server's side. */
export type UploadStatus = 'processing' | 'done' | 'failed' | 'refused';
export type UploadSource = 'upload' | 'feed' | 'correction';

/**
 * One intake: a CSV upload, a feed pull or a one-row correction. Written and updated outside the load's
 * transaction, so the progress (rows processed, heartbeat) is visible while the load runs.
 */
@Entity({ name: 'weather_uploads' })
@Check('weather_uploads_status_check', "status IN ('processing', 'done', 'failed', 'refused')")
@Check('weather_uploads_source_check', "source IN ('upload', 'feed', 'correction')")
@Check('weather_uploads_units_check', "temp_unit IN ('C', 'F') AND rain_unit IN ('mm', 'in')")
@Index('weather_uploads_status_idx', ['status', 'heartbeatAt'])
export class WeatherUploadEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  source: UploadSource;

  /** The client's file name, for display only (never used as a path). */
  @Column({ name: 'file_name', type: 'text', nullable: true })
  fileName: string | null;

  @Column({ type: 'text', default: 'processing' })
  status: UploadStatus;

  @Column({ name: 'temp_unit', type: 'text' })
  tempUnit: 'C' | 'F';

  @Column({ name: 'rain_unit', type: 'text' })
  rainUnit: 'mm' | 'in';

  @Column({ name: 'bytes_total', type: 'bigint', default: 0 })
  bytesTotal: string;

  @Column({ name: 'bytes_processed', type: 'bigint', default: 0 })
  bytesProcessed: string;

  @Column({ name: 'rows_processed', type: 'integer', default: 0 })
  rowsProcessed: number;

  @Column({ name: 'rows_accepted', type: 'integer', default: 0 })
  rowsAccepted: number;

  @Column({ name: 'rows_flagged', type: 'integer', default: 0 })
  rowsFlagged: number;

  @Column({ name: 'rows_rejected', type: 'integer', default: 0 })
  rowsRejected: number;

  /** Accepted rows whose values differed from those already stored (the old ones are in the revisions). */
  @Column({ name: 'rows_replaced', type: 'integer', default: 0 })
  rowsReplaced: number;

  /** Accepted rows held as implausible (stored, left out of the series until confirmed or corrected). */
  @Column({ name: 'rows_held', type: 'integer', default: 0 })
  rowsHeld: number;

  /** Rows not applied because the day was corrected by hand (kept as open conflicts instead). */
  @Column({ name: 'rows_conflicting', type: 'integer', default: 0 })
  rowsConflicting: number;

  /** Capped English text (LIMITS.MESSAGE_MAX_CHARS); the client words a refusal from reasonCode instead. */
  @Column({ type: 'text', nullable: true })
  message: string | null;

  /** Why a refused upload was refused, as a stable code (binary_file, bad_header, line_too_long, …). */
  @Column({ name: 'reason_code', type: 'text', nullable: true })
  reasonCode: string | null;

  /** The values the reason names (a line number, a limit). */
  @Column({ name: 'reason_params', type: 'jsonb', nullable: true })
  reasonParams: Record<string, string | number> | null;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  /** Touched every few seconds by the process doing the load; a stale one means that process died. */
  @Column({ name: 'heartbeat_at', type: 'timestamptz', default: () => 'now()' })
  heartbeatAt: Date;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt: Date | null;
}
