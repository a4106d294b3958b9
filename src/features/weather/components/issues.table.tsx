import { useMemo, useState } from 'react';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { IssueDto } from '../../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { ISSUES_PAGE, issuesCsvUrl, useIssues } from '../api/issues.api';

const column = createColumnHelper<PlainTableFeatures, IssueDto>();
const OUTCOME: Record<IssueDto['severity'], string> = { rejected: 'Rejected', flagged: 'Flagged (kept)', filled: 'Filled' };

/** The row-level report of one intake, a page at a time, with the CSV download. */
export function IssuesTable({ uploadId, onFix }: { uploadId: string; onFix?: (issue: IssueDto) => void }) {
  const [offset, setOffset] = useState(0);
  const issues = useIssues(uploadId, offset, true);
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('rowNumber', { header: 'Row', cell: (c) => <span className="tabular-nums">{c.getValue() ?? '—'}</span> }),
        column.accessor('station', { header: 'Station', cell: (c) => <span className="font-mono text-sm">{c.getValue() ?? ''}</span> }),
        column.accessor('date', { header: 'Date' }),
        column.accessor('column', { header: 'Column' }),
        column.accessor('value', { header: 'Value', cell: (c) => <code className="font-mono text-sm">{c.getValue() ?? ''}</code> }),
        column.accessor('severity', { header: 'Outcome', cell: (c) => <span className={c.getValue() === 'rejected' ? 'font-bold' : undefined}>{OUTCOME[c.getValue()]}</span> }),
        column.accessor('reason', { header: 'Reason' }),
        column.display({
          id: 'fix',
          header: 'Fix',
          cell: ({ row }) =>
            onFix && row.original.severity === 'rejected' && row.original.station && row.original.date ? (
              <button type="button" className="btn btn-secondary btn-small" onClick={() => onFix(row.original)}>
                Correct
              </button>
            ) : null,
        }),
      ]),
    [onFix],
  );
  const data = issues.data?.issues ?? [];
  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (_r, i) => String(offset + i) });
  const total = issues.data?.total ?? 0;
  return (
    <section aria-labelledby={`report-${uploadId}`} className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`report-${uploadId}`} className="section-title">
          Row report {total ? `(${total.toLocaleString('en')} findings)` : ''}
        </h3>
        <a className="btn btn-secondary btn-small" href={issuesCsvUrl(uploadId)} download>
          Download the report (CSV)
        </a>
      </div>
      <DataTable table={table} caption="Rows rejected or flagged, with the reason" captionVisible={false} emptyText="Every row passed the checks." />
      {total > ISSUES_PAGE ? (
        <div className="flex items-center gap-3 text-sm">
          <button type="button" className="btn btn-secondary btn-small" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - ISSUES_PAGE))}>
            Previous
          </button>
          <span className="tabular-nums">
            {offset + 1}–{Math.min(total, offset + ISSUES_PAGE)} of {total.toLocaleString('en')}
          </span>
          <button type="button" className="btn btn-secondary btn-small" disabled={offset + ISSUES_PAGE >= total} onClick={() => setOffset(offset + ISSUES_PAGE)}>
            Next
          </button>
        </div>
      ) : null}
    </section>
  );
}
