import { z } from 'zod';

/**
 * The three imports of issue 17 (docs/import.md): districts from a GeoJSON FeatureCollection or a
 * TopoJSON topology, stations and populations from CSV. Each takes `?dryRun=true` (the full report,
 * nothing written) and `?skipProblems=true` (write the good items, list the rest); otherwise one
 * problem refuses the whole file (422 `import_rejected`, nothing written).
 */
const flag = z.enum(['true', 'false'], { message: 'must be true or false' }).optional();
export const importQuery = z.strictObject({ dryRun: flag, skipProblems: flag });
export type ImportQuery = z.infer<typeof importQuery>;

const propertyName = z.string().trim().min(1, { message: 'is required' }).max(100, { message: 'is too long' });

/** Multipart form fields of `POST /api/districts/import` (all text, as forms send them). */
export const districtImportFields = z
  .strictObject({
    codeProperty: propertyName,
    nameProperty: propertyName,
    parentCodeProperty: propertyName.optional(),
    parentNameProperty: propertyName.optional(),
    populationProperty: propertyName.optional(),
    populationYear: z.coerce.number({ message: 'must be a year' }).int({ message: 'must be a whole year' }).min(1900).max(2100).optional(),
    /** For a TopoJSON topology with several objects: which one holds the districts (default: the first). */
    objectName: propertyName.optional(),
    reason: z.string().trim().max(500).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.populationProperty !== undefined && v.populationYear === undefined)
      ctx.addIssue({ code: 'custom', path: ['populationYear'], message: 'is required with populationProperty' });
    if (v.parentNameProperty !== undefined && v.parentCodeProperty === undefined)
      ctx.addIssue({ code: 'custom', path: ['parentCodeProperty'], message: 'is required with parentNameProperty' });
  });
export type DistrictImportFields = z.infer<typeof districtImportFields>;

/** Multipart form fields of the CSV imports. */
export const csvImportFields = z.strictObject({ reason: z.string().trim().max(500).optional() });

/** One refused item: its place in the file (feature index from 0, or CSV line from 2), its code, why. */
export const importProblem = z.object({
  index: z.number().int(),
  code: z.string().nullable(),
  /** A stable rule code the client words in the person's language (e.g. `code_invalid`, `boundary_self_intersecting`). */
  rule: z.string(),
  /** The values the client words the rule with (a property name, another feature's index or line, distances). */
  params: z.record(z.string(), z.union([z.string(), z.number()])).default({}),
});
export type ImportProblem = z.infer<typeof importProblem>;

export const importReport = z.object({
  dryRun: z.boolean(),
  /** Items read from the file (features or data rows). */
  total: z.number().int(),
  /** Items created / updated (or that would be, in a dry run). */
  created: z.number().int(),
  updated: z.number().int(),
  /** Items left out because of a problem (only with skipProblems, or counted in a dry run). */
  skipped: z.number().int(),
  problems: z.array(importProblem),
  /** Problems beyond the listed ones. */
  problemsNotListed: z.number().int().default(0),
  /** The first items as read, for the preview (code, name and the mapped fields). */
  preview: z.array(z.record(z.string(), z.union([z.string(), z.number(), z.null()]))).default([]),
});
export type ImportReport = z.infer<typeof importReport>;

export const districtImportReport = importReport.extend({
  regions: z.object({ created: z.number().int(), updated: z.number().int() }),
  /** Feature properties found in the file (for the field mapping on screen). */
  properties: z.array(z.string()).default([]),
});
export type DistrictImportReport = z.infer<typeof districtImportReport>;
