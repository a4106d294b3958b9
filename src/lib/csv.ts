/** CSV downloads in the browser; the writer itself is shared with the server (shared/csv.ts). */
export { neutraliseCell, toCsv, type CsvCell } from '../../shared/csv';

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
