import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { SeasonRunDto } from '../../../../shared/api/board.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { useFormat, type Formatters } from '../../../i18n/format';

const STATUS_CLASS: Record<SeasonRunDto['status'], string> = { running: 'status-pending', succeeded: 'status-active', failed: 'status-deactivated' };

const column = createColumnHelper<PlainTableFeatures, SeasonRunDto>();

function buildColumns(t: TFunction, f: Formatters) {
  return column.columns([
    column.accessor('status', {
      header: t('table.status'),
      cell: (c) => (
        <span className="cell-stack">
          <span className={`status ${STATUS_CLASS[c.getValue()]}`}>{t(`status.${c.getValue()}`)}</span>
          <span className="text-xs text-ink-muted">
            {c.row.original.kind === 'nightly' ? t('kind.nightly') : c.row.original.byPerson ? t('kind.manual') : t('kind.system')}
            {c.row.original.full ? `, ${t('kind.full')}` : ''}
          </span>
        </span>
      ),
    }),
    column.accessor('startedAt', { header: t('table.started'), cell: (c) => f.dateTime(c.getValue()) }),
    column.accessor('finishedAt', { header: t('table.finished'), cell: (c) => f.dateTime(c.getValue()) }),
    column.accessor('asOf', { header: t('table.asOf'), cell: (c) => f.date(c.getValue()) }),
    column.accessor((r) => r.districtsDone, {
      id: 'districts',
      header: t('table.districts'),
      cell: (c) => (
        <span className="tabular-nums">
          {t('table.districtsDone', { done: f.number(c.row.original.districtsDone), total: f.number(c.row.original.districtsTotal) })}
          {c.row.original.districtsSkipped ? ` ${t('table.skipped', { count: c.row.original.districtsSkipped, n: f.number(c.row.original.districtsSkipped) })}` : ''}
        </span>
      ),
    }),
    column.accessor('rowsWritten', { header: t('table.rowsWritten'), cell: (c) => <span className="tabular-nums">{f.number(c.getValue())}</span> }),
    column.accessor((r) => r.warnings.length, {
      id: 'warnings',
      header: t('table.warnings'),
      cell: (c) => {
        const run = c.row.original;
        if (run.warnings.length === 0 && !run.error) return <span className="text-ink-muted">{t('table.noWarnings')}</span>;
        return (
          <details>
            <summary className="cursor-pointer font-bold">
              {t('table.warningCount', { count: run.warnings.length, n: f.number(run.warnings.length) })}
              {run.error ? ` ${t('table.andError')}` : ''}
            </summary>
            <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm">
              {run.error ? <li className="font-bold">{t('error', { error: run.error })}</li> : null}
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
}

export function SeasonRunsTable({ runs }: { runs: SeasonRunDto[] }) {
  const { t } = useTranslation('season-runs');
  const f = useFormat();
  const columns = useMemo(() => buildColumns(t, f), [t, f]);
  const table = useTable({ features: plainTableFeatures, columns, data: runs, getRowId: (r) => r.id });
  return <DataTable table={table} caption={t('table.caption')} captionVisible emptyText={t('table.empty')} />;
}
