// Reviewed migrations, in order. Generate with `npm run migration:generate -- server/db/migrations/<Name>`
// against the dev database (see DEVELOPERS.md), review the SQL, then add the class here.
import { Foundation1796164188542 } from './1796164188542-Foundation';

export const migrations = [Foundation1796164188542];
