import { CaseChannelSettingEntity } from './case-channel-setting.entity';
import { CaseCountRevisionEntity } from './case-count-revision.entity';
import { CaseCountEntity } from './case-count.entity';
import { CaseDistrictSettingEntity } from './case-district-setting.entity';
import { CaseWeekClosureEntity } from './case-week-closure.entity';
import { DiseaseEntity } from './disease.entity';
import { LarvalSurveyEntity } from './larval-survey.entity';

/** Entities of the case ledger and surveys, added to the DataSource by server/db/entities.ts. */
export const casesEntities: Function[] = [
  DiseaseEntity,
  CaseCountEntity,
  CaseCountRevisionEntity,
  CaseWeekClosureEntity,
  CaseDistrictSettingEntity,
  CaseChannelSettingEntity,
  LarvalSurveyEntity,
];
