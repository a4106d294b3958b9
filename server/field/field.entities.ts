import { FieldTeamMemberEntity } from './field-team-member.entity';
import { FieldTeamEntity } from './field-team.entity';

/** Entities of the Field week (issue 19). */
export const fieldEntities = [FieldTeamEntity, FieldTeamMemberEntity];
