import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { UserEntity } from '../users/user.entity';
import { CaseCountEntity } from './case-count.entity';

/** The values of a count at one version (what a revision records before and after). */
export interface CountValues {
  cases: number;
  confirmed: number | null;
  probable: number | null;
  ageBands: Record<string, number> | null;
}

/** Every write to a count — the first entry and each correction — with who, when, old, new and why. Never updated. */
@Entity({ name: 'case_count_revisions' })
@Index('case_count_revisions_count_idx', ['caseCountId', 'version'])
export class CaseCountRevisionEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'case_count_id', type: 'uuid' })
  caseCountId: string;

  @Column({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  /** 'entry' | 'correction' | 'void' (a void keeps the values: old and new are the count as it was) */
  @Column({ type: 'text' })
  kind: 'entry' | 'correction' | 'void';

  /** 'form' | 'grid' | 'upload' | 'demo' */
  @Column({ type: 'text' })
  source: string;

  @Column({ name: 'old_values', type: 'jsonb', nullable: true })
  oldValues: CountValues | null;

  @Column({ name: 'new_values', type: 'jsonb' })
  newValues: CountValues;

  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @ManyToOne(() => CaseCountEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'case_count_id' })
  count?: CaseCountEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actor_id' })
  actor?: UserEntity;
}
