import { CaseLedger1796165141357 } from './migrations/1796165141357-CaseLedger';

/** Reviewed migrations of the case ledger and surveys (TypeORM orders all migrations by their timestamp). */
export const casesMigrations: Function[] = [CaseLedger1796165141357];
