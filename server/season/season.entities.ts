import { DistrictProfileEntity } from './district-profile.entity';
import { DistrictRunStateEntity } from './district-run-state.entity';
import { DistrictTierEntity } from './district-tier.entity';
import { SeasonRunEntity } from './season-run.entity';
import { TierSettingsVersionEntity } from './tier-settings-version.entity';
import { VectorClockSeasonEntity } from './vector-clock-season.entity';

export const seasonEntities: Function[] = [
  SeasonRunEntity,
  VectorClockSeasonEntity,
  DistrictTierEntity,
  DistrictProfileEntity,
  TierSettingsVersionEntity,
  DistrictRunStateEntity,
];
