import { FieldSettingsEntity } from './field-settings.entity';
import { FieldTeamMemberEntity } from './field-team-member.entity';
import { FieldTeamEntity } from './field-team.entity';
import { FieldWeekDayEntity } from './field-week-day.entity';
import { FieldWeekEntity } from './field-week.entity';

/** Entities of the Field week (issue 19). */
export const fieldEntities = [FieldTeamEntity, FieldTeamMemberEntity, FieldWeekEntity, FieldWeekDayEntity, FieldSettingsEntity];
