/** `npm run check`: the guard rails alone (type check, lint, layer rules), as `npm test` runs them. */
import { runGuardRails } from './lib/guard-rails';

process.exit((await runGuardRails()) ? 0 : 1);
