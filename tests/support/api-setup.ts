import 'reflect-metadata';
import { freshTestDatabase } from './test-database';

// Runs before each API or browser test file: its own database, copied from the migrated template.
process.env.DATABASE_URL = await freshTestDatabase();
