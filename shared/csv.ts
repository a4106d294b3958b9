/**
 * The one CSV writer, for the browser's downloads and the server's reports alike. Hand-written because
 * it is a few lines: RFC 4180 quoting plus the spreadsheet guard. A text cell that starts with = + - @,
 * a tab or a carriage return could be read as a formula (OWASP, "CSV Injection"), so it is prefixed
 * with a single quote. Numbers are written as numbers: a negative number is data, not a formula.
 */
export type CsvCell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

/** The cell's text with the formula guard, not yet quoted. */
export function neutraliseCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = String(value);
  return FORMULA_START.test(text) ? `'${text}` : text;
}

function quote(text: string): string {
  return /[",\n\r]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One cell, guarded and quoted. */
export function csvCell(value: CsvCell): string {
  return quote(neutraliseCell(value));
}

/** One line of cells (no line end). */
export function csvLine(cells: readonly CsvCell[]): string {
  return cells.map(csvCell).join(',');
}

/** RFC 4180 text (CRLF line ends), every cell guarded. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map(csvLine).join('\r\n') + '\r\n';
}
