/** Reviewed migrations of the case ledger and surveys (TypeORM orders all migrations by their timestamp). */
export const casesMigrations: Function[] = [];
