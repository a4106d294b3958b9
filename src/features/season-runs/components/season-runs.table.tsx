import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { SeasonRunDto } from '../../../../shared/api/board.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { formatDateTime, formatDay } from '../../ladder/ladder-format';

const STATUS_WORDS: Record<SeasonRunDto['status'], string> = { running: 'running', succeeded: 'finished', failed: 'failed' };
const STATUS_CLASS: Record<SeasonRunDto['status'], string> = { running: 'status-pending', succeeded: 'status-active', failed: 'status-deactivated' };

const column = createColumnHelper<PlainTableFeatures, SeasonRunDto>();
const columns = column.columns([
  column.accessor('status', {
    header: 'Status',
    cell: (c) => (
      <span className="cell-stack">
        <span className={`status ${STATUS_CLASS[c.getValue()]}`}>{STATUS_WORDS[c.getValue()]}</span>
        <span className="text-xs text-ink-muted">
          {c.row.original.kind === 'nightly' ? 'nightly' : 'by hand'}
          {c.row.original.full ? ', whole season' : ''}
        </span>
      </span>
    ),
  }),
  column.accessor('startedAt', { header: 'Started', cell: (c) => formatDateTime(c.getValue()) }),
  column.accessor('finishedAt', { header: 'Finished', cell: (c) => formatDateTime(c.getValue()) }),
  column.accessor('asOf', { header: 'Data up to', cell: (c) => formatDay(c.getValue()) }),
  column.accessor((r) => `${r.districtsDone} / ${r.districtsTotal}`, {
    id: 'districts',
    header: 'Districts done',
    cell: (c) => (
      <span className="tabular-nums">
        {c.getValue()}
        {c.row.original.districtsSkipped ? ` (${c.row.original.districtsSkipped} skipped)` : ''}
      </span>
    ),
  }),
  column.accessor('rowsWritten', { header: 'Rows written', cell: (c) => <span className="tabular-nums">{c.getValue().toLocaleString('en-GB')}</span> }),
  column.accessor((r) => r.warnings.length, {
    id: 'warnings',
    header: 'Warnings',
    cell: (c) => {
      const run = c.row.original;
      if (run.warnings.length === 0 && !run.error) return <span className="text-ink-muted">none</span>;
      return (
        <details>
          <summary className="cursor-pointer font-bold">
            {run.warnings.length} warning{run.warnings.length === 1 ? '' : 's'}
            {run.error ? ' and an error' : ''}
          </summary>
          <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm">
            {run.error ? <li className="font-bold">Error: {run.error}</li> : null}
            {run.warnings.map((w, i) => (
              <li key={i}>
                <span className="font-mono text-xs">{w.code}</span> {w.message}
              </li>
            ))}
          </ul>
        </details>
      );
    },
  }),
]);

export function SeasonRunsTable({ runs }: { runs: SeasonRunDto[] }) {
  const table = useTable({ features: plainTableFeatures, columns, data: runs, getRowId: (r) => r.id });
  return <DataTable table={table} caption="Season runs, newest first" captionVisible emptyText="No season run yet." />;
}
