import type { ImportReport } from '../../shared/api/imports.schema';

/** Problems listed in one import report; the rest are counted in `problemsNotListed`. */
export const MAX_LISTED_PROBLEMS = 500;
/** Items shown in the preview of a report (the screen's first rows). */
export const PREVIEW_ROWS = 10;

/** Thrown when a file has problems and the admin did not ask to skip them: the route answers 422 with the report. */
export class ImportRejected extends Error {
  constructor(readonly report: ImportReport, readonly count: number) {
    super(`The file was not imported: ${count} problem${count === 1 ? '' : 's'}. Nothing was written.`);
  }
}
