/**
 * CSV for people who open it in a spreadsheet. A cell that starts with = + - @, a tab or a carriage return
 * could be read as a formula (CSV injection), so it is prefixed with a single quote. Numbers are written as
 * numbers (a negative number is data, not a formula).
 */
export type CsvCell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

export function neutraliseCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = String(value);
  return FORMULA_START.test(text) ? `'${text}` : text;
}

function quote(text: string): string {
  return /[",\n\r]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

/** RFC 4180 text (CRLF line ends), every cell neutralised. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((r) => r.map((c) => quote(neutraliseCell(c))).join(',')).join('\r\n') + '\r\n';
}

/** Offers the text as a file download (a Blob URL: allowed by the app's Content-Security-Policy). */
export function downloadCsv(fileName: string, csv: string): void {
  const url = URL.createObjectURL(new Blob(['\ufeff', csv], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
