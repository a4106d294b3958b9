import { FieldApproval1796601500000 } from './migrations/1796601500000-FieldApproval';
import { FieldTeams1796600900000 } from './migrations/1796600900000-FieldTeams';
import { FieldWeeks1796600910000 } from './migrations/1796600910000-FieldWeeks';

/** Reviewed migrations of the Field week (issue 19). */
export const fieldMigrations: Function[] = [FieldTeams1796600900000, FieldWeeks1796600910000, FieldApproval1796601500000];
