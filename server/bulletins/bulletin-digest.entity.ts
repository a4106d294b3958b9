import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Language } from '../../shared/api/auth.schema';
import { UserEntity } from '../users/user.entity';

/** How a digest is laid out: each followed district in detail, or the region's ranking and what changed. */
export type DigestLayout = 'detail' | 'overview';

/**
 * One person's weekly bulletin: a digest of every district they follow, in their language, with one named
 * PDF. One per person and epidemiological week (the unique index), so a second send of the same week
 * queues nothing for them. The per-recipient HTML and text live on the outbox message; the PDF is kept
 * here once and attached by the outbox worker.
 */
@Entity({ name: 'bulletin_digests' })
@Index('bulletin_digests_user_week_key', ['userId', 'epiYear', 'epiWeek'], { unique: true })
@Check('bulletin_digests_language_check', "language IN ('en', 'fr', 'es', 'pt')")
@Check('bulletin_digests_layout_check', "layout IN ('detail', 'overview')")
export class BulletinDigestEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Column({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @Column({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ type: 'text' })
  language: Language;

  @Column({ type: 'text' })
  layout: DigestLayout;

  /** The districts the digest covers, in the order it shows them. */
  @Column({ name: 'district_ids', type: 'uuid', array: true })
  districtIds: string[];

  @Column({ type: 'text' })
  subject: string;

  /** The attachment's file name: broodcast-<region>-<year>-w<week>.pdf. */
  @Column({ name: 'pdf_name', type: 'text' })
  pdfName: string;

  @Column({ type: 'bytea' })
  pdf: Buffer;

  /** Null when the weekly job wrote it; the user who pressed "send now" otherwise. */
  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
