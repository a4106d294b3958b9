import { DistrictProfileEntity } from './district-profile.entity';
import { DistrictRunStateEntity } from './district-run-state.entity';
import { DistrictTierEntity } from './district-tier.entity';
import { SeasonRunEntity } from './season-run.entity';
import { TierSettingsVersionEntity } from './tier-settings-version.entity';
import { VectorClockDayEntity } from './vector-clock-day.entity';

export const seasonEntities: Function[] = [
  SeasonRunEntity,
  VectorClockDayEntity,
  DistrictTierEntity,
  DistrictProfileEntity,
  TierSettingsVersionEntity,
  DistrictRunStateEntity,
];
