import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';

export type SeriesTableCell = string | number | null | undefined;

/** The plain-table equivalent of a chart: one header row, one row per point. */
export function SeriesTable({
  caption,
  header,
  rows,
  emptyText,
}: {
  caption: ReactNode;
  header: readonly string[];
  rows: readonly (readonly SeriesTableCell[])[];
  emptyText?: string;
}) {
  const { t } = useTranslation('components');
  return (
    <div className="table-wrap chart-table">
      <table className="data-table">
        <caption className="table-caption">{caption}</caption>
        <thead>
          <tr>
            {header.map((h) => (
              <th key={h} scope="col">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={header.length} className="text-ink-muted">
                {emptyText ?? t('seriesTable.empty')}
              </td>
            </tr>
          ) : (
            rows.map((r, i) => (
              <tr key={i}>
                {r.map((c, j) =>
                  j === 0 ? (
                    <th key={j} scope="row" className="font-normal">
                      {c ?? '—'}
                    </th>
                  ) : (
                    <td key={j} className="tabular-nums">
                      {c === null || c === undefined || c === '' ? '—' : c}
                    </td>
                  ),
                )}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
