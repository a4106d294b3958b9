import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';

/** Which vector–pathogen profiles the season run computes for a district, with an optional biofix. */
@Entity({ name: 'district_profiles' })
export class DistrictProfileEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'profile_id', type: 'text' })
  profileId: string;

  /** Month-day (MM-DD) overriding the profile's default biofix; null keeps the default. */
  @Column({ type: 'text', nullable: true })
  biofix: string | null;

  /** Who assigned this profile (PUT /api/districts/profiles); null for the demo seed and older rows. */
  @Column({ name: 'assigned_by', type: 'uuid', nullable: true })
  assignedBy: string | null;

  @Column({ name: 'assigned_at', type: 'timestamptz', nullable: true })
  assignedAt: Date | null;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
