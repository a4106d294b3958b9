// Reviewed migrations, in order. Generate with `npm run migration:generate -- server/db/migrations/<Name>`
// against the dev database (see DEVELOPERS.md), review the SQL, then add the class here.
import { Foundation1796164188542 } from './1796164188542-Foundation';

import { casesMigrations } from '../../cases/cases.migrations';
import { weatherMigrations } from '../../weather/weather.migrations';
import { seasonMigrations } from '../../season/season.migrations';
import { flagsMigrations } from '../../flags/flags.migrations';
import { usersMigrations } from '../../users/users.migrations';
import { profilesMigrations } from '../../profiles/profiles.migrations';
import { districtsMigrations } from '../../districts/districts.migrations';
import { skillMigrations } from '../../skill/skill.migrations';
import { fieldMigrations } from '../../field/field.migrations';
import { FieldRecords1796601400000 } from '../../field/migrations/1796601400000-FieldRecords';

// Each feature keeps its own list; TypeORM runs them all in timestamp order.
export const migrations: Function[] = [Foundation1796164188542, ...weatherMigrations, ...casesMigrations, ...seasonMigrations, ...flagsMigrations, ...usersMigrations, ...profilesMigrations, ...districtsMigrations, ...skillMigrations, ...fieldMigrations, FieldRecords1796601400000];
