import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/**
 * One district's bulletin for one epidemiological week, as written (HTML and text before the
 * per-recipient footer, and the PDF every recipient gets attached). One per district and week, so a
 * second send of the same week queues nothing.
 */
@Entity({ name: 'bulletins' })
@Index('bulletins_district_week_key', ['districtId', 'epiYear', 'epiWeek'], { unique: true })
export class BulletinEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @Column({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @Column({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ type: 'text' })
  subject: string;

  @Column({ type: 'text' })
  html: string;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'bytea' })
  pdf: Buffer;

  /** Null when the weekly job wrote it; the user who pressed "send now" otherwise. */
  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by' })
  creator?: UserEntity;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
