import { CaseLedger1796165141357 } from './migrations/1796165141357-CaseLedger';
import { VoidEntries1796403169747 } from './migrations/1796403169747-VoidEntries';

/** Reviewed migrations of the case ledger and surveys (TypeORM orders all migrations by their timestamp). */
export const casesMigrations: Function[] = [CaseLedger1796165141357, VoidEntries1796403169747];
