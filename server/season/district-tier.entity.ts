import { Check, Column, Entity, Index, PrimaryColumn } from 'typeorm';
import type { DriverResult } from '../../shared/tier';

/** A district's tier for one epidemiological week, with the drivers that explain it. */
@Entity({ name: 'district_tiers' })
@Index('district_tiers_week_idx', ['epiYear', 'epiWeek'])
// The board's cache version reads max(computed_at) on every request: an index makes it one lookup.
@Index('district_tiers_computed_at_idx', ['computedAt'])
@Check('district_tiers_tier_check', "tier IN ('baseline', 'raised', 'high', 'critical')")
export class DistrictTierEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @PrimaryColumn({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ name: 'run_id', type: 'uuid' })
  runId: string;

  @Column({ name: 'computed_at', type: 'timestamptz' })
  computedAt: Date;

  @Column({ name: 'as_of', type: 'date' })
  asOf: string;

  @Column({ type: 'real' })
  score: number;

  @Column({ type: 'text' })
  tier: string;

  @Column({ name: 'tier_low', type: 'text' })
  tierLow: string;

  @Column({ name: 'tier_high', type: 'text' })
  tierHigh: string;

  @Column({ type: 'text' })
  confidence: string;

  @Column({ type: 'jsonb' })
  drivers: DriverResult[];

  @Column({ type: 'jsonb' })
  notes: string[];

  @Column({ name: 'leading_driver', type: 'text', nullable: true })
  leadingDriver: string | null;

  @Column({ name: 'changed_driver', type: 'text', nullable: true })
  changedDriver: string | null;

  @Column({ name: 'profile_id', type: 'text', nullable: true })
  profileId: string | null;

  @Column({ name: 'cases_this_week', type: 'integer', nullable: true })
  casesThisWeek: number | null;

  /** The week `casesThisWeek` counts: the newest complete week (reporting over) at the run's as-of date. */
  @Column({ name: 'cases_epi_year', type: 'integer', nullable: true })
  casesEpiYear: number | null;

  @Column({ name: 'cases_epi_week', type: 'integer', nullable: true })
  casesEpiWeek: number | null;

  /** The diseases whose counts make up `casesThisWeek` (those reported in that week). */
  @Column({ name: 'cases_disease_ids', type: 'uuid', array: true, nullable: true })
  casesDiseaseIds: string[] | null;

  @Column({ name: 'channel_zone', type: 'text', nullable: true })
  channelZone: string | null;

  @Column({ name: 'latest_weather', type: 'date', nullable: true })
  latestWeather: string | null;
}
