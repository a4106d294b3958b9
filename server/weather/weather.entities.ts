/** Entities of the weather feature, added to the DataSource by server/db/entities.ts. */
export const weatherEntities: Function[] = [];
