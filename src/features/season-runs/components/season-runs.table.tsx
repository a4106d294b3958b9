import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { SeasonRunDto } from '../../../../shared/api/board.schema';
import type { RunWarning } from '../../../../shared/api/problems.schema';
import { i18n } from '../../../i18n';
import { problemReasonText } from '../../../lib/problem-text';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { useFormat, type Formatters } from '../../../i18n/format';

const STATUS_CLASS: Record<SeasonRunDto['status'], string> = { running: 'status-pending', succeeded: 'status-active', failed: 'status-deactivated' };

const column = createColumnHelper<PlainTableFeatures, SeasonRunDto>();

function buildColumns(t: TFunction, f: Formatters) {
  return column.columns([
    column.accessor('status', {
      header: t('table.status'),
      cell: (c) => (
        <span className="flex flex-col items-start gap-0.5">
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
          {failedSummary(c.row.original, t, f)}
        </span>
      ),
    }),
    column.accessor('rowsWritten', { header: t('table.rowsWritten'), cell: (c) => <span className="tabular-nums">{f.number(c.getValue())}</span> }),
    column.accessor((r) => r.warnings.length + (r.warningsNotListed ?? 0), {
      id: 'warnings',
      header: t('table.warnings'),
      cell: (c) => {
        const run = c.row.original;
        const total = c.getValue();
        const notListed = run.warningsNotListed ?? 0;
        if (total === 0 && !run.error) return <span className="text-ink-muted">{t('table.noWarnings')}</span>;
        return (
          <details>
            <summary className="cursor-pointer font-bold">
              {t('table.warningCount', { count: total, n: f.number(total) })}
              {run.error ? ` ${t('table.andError')}` : ''}
            </summary>
            <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm">
              {run.error ? <li className="font-bold">{runErrorText(run.error, t)}</li> : null}
              {run.warnings.map((w, i) => (
                <li key={i} className={w.code === 'district_failed' ? 'font-bold' : undefined}>{warningText(w, t)}</li>
              ))}
              {notListed > 0 ? (
                <li className="italic" data-testid="warnings-not-listed">
                  {t('table.notListed', { count: notListed, n: f.number(notListed), kept: f.number(run.warnings.length) })}
                </li>
              ) : null}
            </ul>
          </details>
        );
      },
    }),
  ]);
}

/** One run warning in words: the server sends a code with parameters, never a sentence (shared/api/problems.schema.ts). */
export function warningText(w: RunWarning, t: TFunction): string {
  const district = w.districtName ?? t('warning.unknownDistrict');
  if (w.code === 'district_failed') {
    const key = w.params?.stage === 'write' ? 'warning.district_failed_write' : 'warning.district_failed_compute';
    return t(key, { district, reason: problemReasonText(w.reason) });
  }
  if (w.code === 'weather_held')
    return t('warning.weather_held', { n: String(w.params?.count ?? ''), stations: String(w.params?.stations ?? '') });
  const key = `warning.${w.code}`;
  if (i18n.exists(key, { ns: 'season-runs' })) return t(key, { district });
  // A run stored before warnings became codes kept its own words.
  return w.message ?? t('warning.other', { district, code: w.code });
}

/** The run's own error: a known code in words, anything else named as it was stored. */
export function runErrorText(error: string, t: TFunction): string {
  const key = `runError.${error}`;
  return i18n.exists(key, { ns: 'season-runs' }) ? t(key) : t('error', { error });
}

/** "1 failed: Pellam Highlands" after "11 / 12", naming the districts the run left out. */
export function failedSummary(run: SeasonRunDto, t: TFunction, f: Formatters): string {
  const failed = run.warnings.filter((w) => w.code === 'district_failed');
  if (failed.length === 0) return '';
  const names = failed.map((w) => w.districtName ?? t('warning.unknownDistrict')).join(', ');
  return ` · ${t('table.failed', { count: failed.length, n: f.number(failed.length), names })}`;
}

export function SeasonRunsTable({ runs }: { runs: SeasonRunDto[] }) {
  const { t } = useTranslation('season-runs');
  const f = useFormat();
  const columns = useMemo(() => buildColumns(t, f), [t, f]);
  const table = useTable({ features: plainTableFeatures, columns, data: runs, getRowId: (r) => r.id });
  return <DataTable table={table} caption={t('table.caption')} captionVisible emptyText={t('table.empty')} />;
}
