import { AuditEventEntity } from '../audit/audit-event.entity';
import { OneTimeTokenEntity } from '../auth/one-time-token.entity';
import { SessionEntity } from '../auth/session.entity';
import { DistrictPopulationEntity } from '../districts/district-population.entity';
import { DistrictEntity } from '../districts/district.entity';
import { UserDistrictEntity } from '../users/user-district.entity';
import { UserRegionEntity } from '../users/user-region.entity';
import { RegionEntity } from '../districts/region.entity';
import { UserEntity } from '../users/user.entity';
import { casesEntities } from '../cases/cases.entities';
import { weatherEntities } from '../weather/weather.entities';
import { seasonEntities } from '../season/season.entities';
import { flagsEntities } from '../flags/flags.entities';
import { profilesEntities } from '../profiles/profiles.entities';
import { skillEntities } from '../skill/skill.entities';
import { fieldEntities } from '../field/field.entities';
import { FieldRecordEntity } from '../field/field-record.entity';

/** Every entity, listed by hand so the DataSource works the same under tsx, vitest and the CLI. */
export const entities = [
  UserEntity,
  UserDistrictEntity,
  UserRegionEntity,
  RegionEntity,
  DistrictEntity,
  DistrictPopulationEntity,
  SessionEntity,
  OneTimeTokenEntity,
  AuditEventEntity,
  ...weatherEntities,
  ...casesEntities,
  ...seasonEntities,
  ...flagsEntities,
  ...profilesEntities,
  ...skillEntities,
  ...fieldEntities,
  FieldRecordEntity,
];
