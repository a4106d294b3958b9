import path from 'node:path';
import type { NextFunction, Request, Response } from 'express';
import { HttpError } from './errors';

/** Human size of a byte limit: 2 MB, 200 MB, 512 bytes. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024 && bytes % (1024 * 1024) === 0) return `${bytes / (1024 * 1024)} MB`;
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  if (bytes >= 1024 && bytes % 1024 === 0) return `${bytes / 1024} kB`;
  return `${bytes} bytes`;
}

/**
 * Put before the multer middleware of an upload route: the error middleware then names the limit in
 * the 413 answer ("larger than the limit of 2 MB") instead of multer's bare "File too large".
 */
export const uploadLimit = (bytes: number) => (_req: Request, res: Response, next: NextFunction) => {
  res.locals.uploadLimitBytes = bytes;
  next();
};

const CSV_EXTENSIONS = new Set(['.csv', '.txt']);
/** What browsers and mail programs send for a .csv file (Windows with a spreadsheet installed says ms-excel). */
const CSV_TYPES = new Set([
  'text/csv', 'text/plain', 'application/csv', 'text/x-csv', 'text/comma-separated-values', 'application/vnd.ms-excel',
  'application/octet-stream',
]);
/** Leading bytes of formats that are sometimes saved with a .csv name by mistake. */
const BINARY_SIGNATURES: [string, number[]][] = [
  ['a ZIP archive or an .xlsx workbook', [0x50, 0x4b, 0x03, 0x04]],
  ['a PDF', [0x25, 0x50, 0x44, 0x46]],
  ['a PNG image', [0x89, 0x50, 0x4e, 0x47]],
  ['a JPEG image', [0xff, 0xd8, 0xff]],
  ['a GIF image', [0x47, 0x49, 0x46, 0x38]],
  ['a gzip file', [0x1f, 0x8b]],
  ['an old .xls workbook', [0xd0, 0xcf, 0x11, 0xe0]],
];

/** Why the first bytes of a file are not CSV text, or null when they may be. */
export function notCsvReason(head: Buffer): string | null {
  for (const [what, sig] of BINARY_SIGNATURES) if (sig.every((b, i) => head[i] === b)) return `is ${what}, not CSV text`;
  if (head.includes(0)) return 'holds binary data (NUL bytes), not CSV text';
  return null;
}

/**
 * Put after the multer middleware: the file must be named .csv or .txt and be declared as a text or
 * CSV type; a file held in memory (the case ledger's) must also start like text (no ZIP, PDF, image or
 * NUL bytes). Otherwise 415 `unsupported_file_type` naming the field. A file streamed to disk (weather)
 * has its content checked by the intake itself, which records the upload as failed ("not a text CSV").
 * The client's file name is only read here, never used as a path.
 */
export function checkCsvUpload(req: Request, _res: Response, next: NextFunction) {
  const file = req.file;
  if (!file) return next();
  const refuse = (message: string) =>
    next(new HttpError(415, 'unsupported_file_type', `The file ${message}. Send a CSV file (.csv).`, [{ path: file.fieldname, message }]));
  try {
    const ext = path.extname(file.originalname ?? '').toLowerCase();
    if (!CSV_EXTENSIONS.has(ext)) return refuse(`name ends in "${ext || '(nothing)'}", not .csv`);
    if (!CSV_TYPES.has(String(file.mimetype).toLowerCase())) return refuse(`is declared as ${file.mimetype}, not CSV`);
    const reason = file.buffer ? notCsvReason(file.buffer.subarray(0, 512)) : null;
    if (reason) return refuse(reason);
    next();
  } catch (err) {
    next(err);
  }
}
