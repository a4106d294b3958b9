import type { Request, Response } from 'express';
import multer from 'multer';
import { csvImportFields, districtImportFields, importQuery, type ImportQuery } from '../../shared/api/imports.schema';
import type { AppContext } from '../app-context';
import { badRequest, HttpError } from '../http/errors';
import { defineRoute, type RouteDef } from '../http/route';
import { checkCsvUpload, uploadLimit } from '../http/uploads';
import { CSV_IMPORT_MAX_BYTES, CsvImportsService } from './csv-imports.service';
import { DISTRICT_IMPORT_MAX_BYTES, DistrictImportService } from './district-import.service';
import { ImportRejected } from './import-common';
import { districtImportReport, importReport } from '../../shared/api/imports.schema';

const GEO_EXTENSIONS = /\.(geojson|json|topojson)$/i;

/** A district file must be named .geojson, .topojson or .json (its content is checked when read). */
function checkGeoUpload(req: Request, _res: Response, next: (err?: unknown) => void) {
  const file = req.file;
  if (file && !GEO_EXTENSIONS.test(file.originalname ?? ''))
    return next(new HttpError(415, 'unsupported_file_type', 'The file is not GeoJSON or TopoJSON. Send a .geojson, .topojson or .json file.',
      [{ path: 'file', message: 'name does not end in .geojson, .topojson or .json' }]));
  next();
}

const optionsOf = (q: ImportQuery) => ({ dryRun: q.dryRun === 'true', skipProblems: q.skipProblems === 'true' });

/** Runs an import; a refused file answers 422 `import_rejected` with the whole report (nothing was written). */
async function answer<T>(res: Response, run: () => Promise<T>): Promise<T | undefined> {
  try {
    return await run();
  } catch (err) {
    if (!(err instanceof ImportRejected)) throw err;
    res.status(422).json({
      error: {
        code: 'import_rejected',
        message: err.message,
        params: { problems: err.count },
        fields: err.report.problems.slice(0, 20).map((p) => ({ path: `item ${p.index}${p.code ? ` (${p.code})` : ''}`, message: p.rule })),
      },
      report: err.report,
    });
    return undefined;
  }
}

const fileOf = (req: Request) => {
  if (!req.file) throw badRequest('file_missing', 'Attach the file in the field "file".', [{ path: 'file', message: 'is required' }]);
  return req.file.buffer;
};

/** The three imports of issue 17 (docs/import.md): admin only, each with a dry run. */
export function importsRoutes(ctx: AppContext): RouteDef[] {
  const districts = new DistrictImportService(ctx);
  const csv = new CsvImportsService(ctx);
  // Memory storage: the file is parsed and dropped; the size limit bounds memory.
  const geoUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: DISTRICT_IMPORT_MAX_BYTES, files: 1, fields: 10 } });
  const csvUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: CSV_IMPORT_MAX_BYTES, files: 1, fields: 2 } });
  return [
    defineRoute({
      method: 'post', path: '/districts/import', access: 'districts.manage', response: districtImportReport, query: importQuery, body: districtImportFields,
      before: [uploadLimit(DISTRICT_IMPORT_MAX_BYTES), geoUpload.single('file'), checkGeoUpload],
      handler: ({ principal, body, query }, req, res) => answer(res, () => districts.import(principal, fileOf(req), body, optionsOf(query))),
    }),
    defineRoute({
      method: 'post', path: '/districts/populations/import', access: 'districts.manage', response: importReport, query: importQuery, body: csvImportFields,
      before: [uploadLimit(CSV_IMPORT_MAX_BYTES), csvUpload.single('file'), checkCsvUpload],
      handler: ({ principal, body, query }, req, res) => answer(res, () => csv.populations(principal, fileOf(req), body.reason, optionsOf(query))),
    }),
    defineRoute({
      method: 'post', path: '/weather/stations/import', access: 'districts.manage', response: importReport, query: importQuery, body: csvImportFields,
      before: [uploadLimit(CSV_IMPORT_MAX_BYTES), csvUpload.single('file'), checkCsvUpload],
      handler: ({ principal, body, query }, req, res) => answer(res, () => csv.stations(principal, fileOf(req), body.reason, optionsOf(query))),
    }),
  ];
}
