/** Reviewed migrations of the weather feature (TypeORM orders all migrations by their timestamp). */
export const weatherMigrations: Function[] = [];
