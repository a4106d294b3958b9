import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/**
 * A local variant of a published profile: a full copy (validated by the profile schema) under its own id,
 * with the list of changed parameters and the source given for each. Published profiles ship with the
 * code and are never edited in place.
 */
@Entity({ name: 'profile_variants' })
export class ProfileVariantEntity {
  @PrimaryColumn({ type: 'text' })
  id: string;

  @Column({ name: 'base_profile_id', type: 'text' })
  baseProfileId: string;

  @Column({ type: 'text' })
  name: string;

  /** The whole profile (shared/model/profile.schema.ts) as stored. */
  @Column({ type: 'jsonb' })
  profile: unknown;

  /** [{path, before, after, source}] — what differs from the base profile and why. */
  @Column({ type: 'jsonb' })
  changes: unknown;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
