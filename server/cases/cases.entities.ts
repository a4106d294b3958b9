/** Entities of the case ledger and surveys, added to the DataSource by server/db/entities.ts. */
export const casesEntities: Function[] = [];
