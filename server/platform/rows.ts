import { z } from 'zod';

/**
 * Raw SQL answers arrive as `any[]` from the driver; repositories parse them with a small zod schema so a
 * renamed column or a changed type fails loudly here rather than as `undefined` in a screen.
 * node-postgres gives timestamptz as Date, json as parsed values, int4 as number, int8/numeric as string.
 */
export function parseRows<S extends z.ZodType>(schema: S, rows: unknown): z.infer<S>[] {
  return z.array(schema).parse(rows);
}

/** The first row, parsed, or null when there is none. */
export function parseFirst<S extends z.ZodType>(schema: S, rows: unknown): z.infer<S> | null {
  const all = parseRows(schema, rows);
  return all[0] ?? null;
}

/** A timestamp column: Date from node-postgres, or text when built inside json. */
export const timestampColumn = z.union([z.date(), z.string()]);
