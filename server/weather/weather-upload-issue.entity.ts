import { Check, Column, Entity, Index, PrimaryGeneratedColumn, JoinColumn, ManyToOne } from 'typeorm';
import { WeatherUploadEntity } from './weather-upload.entity';

/** One line of an intake's row-level report: a rejected, flagged or held value and why. */
@Entity({ name: 'weather_upload_issues' })
@Check('weather_upload_issues_severity_check', "severity IN ('rejected', 'flagged', 'filled', 'held')")
@Index('weather_upload_issues_upload_idx', ['uploadId', 'rowNumber'])
export class WeatherUploadIssueEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'upload_id', type: 'uuid' })
  uploadId: string;

  /** Row of the file (the header is row 1); null for a finding about a day rather than a row. */
  @Column({ name: 'row_number', type: 'integer', nullable: true })
  rowNumber: number | null;

  @Column({ type: 'text', nullable: true })
  station: string | null;

  @Column({ type: 'text', nullable: true })
  date: string | null;

  @Column({ type: 'text' })
  column: string;

  @Column({ type: 'text', nullable: true })
  value: string | null;

  @Column({ type: 'text' })
  severity: 'rejected' | 'flagged' | 'filled' | 'held';

  @Column({ type: 'text' })
  rule: string;

  @Column({ type: 'text' })
  reason: string;

  /** The figures a held line's reason names (column, value, median, MAD, modified z-score, basis…). */
  @Column({ type: 'jsonb', nullable: true })
  params: Record<string, string | number | null> | null;

  @ManyToOne(() => WeatherUploadEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'upload_id' })
  upload?: WeatherUploadEntity;
}
