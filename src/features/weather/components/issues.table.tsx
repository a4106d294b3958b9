import { useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { IssueDto, UploadDto } from '../../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { useFormat } from '../../../i18n/format';
import { useUnits } from '../../../lib/units';
import { useConfirmDay } from '../api/confirm-day.api';
import { ISSUES_PAGE, issuesCsvUrl, useIssues } from '../api/issues.api';
import { ReasonAction } from './reason-action';
import { issueReason, issueValue } from '../weather-units';

const column = createColumnHelper<PlainTableFeatures, IssueDto>();

/** The row-level report of one intake, a page at a time, with the CSV download (in the user's units). */
export function IssuesTable({ upload, onFix }: { upload: Pick<UploadDto, 'id' | 'tempUnit' | 'rainUnit'>; onFix?: (issue: IssueDto) => void }) {
  const { t, i18n } = useTranslation('weather');
  const format = useFormat();
  const units = useUnits();
  const uploadId = upload.id;
  const [offset, setOffset] = useState(0);
  const issues = useIssues(uploadId, offset, true);
  const confirm = useConfirmDay();
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('rowNumber', { header: t('report.row'), cell: (c) => <span className="tabular-nums">{c.getValue() ?? '—'}</span> }),
        column.accessor('station', { header: t('report.station'), cell: (c) => <span className="font-mono text-sm">{c.getValue() ?? ''}</span> }),
        column.accessor('date', { header: t('report.date') }),
        column.accessor('column', { header: t('report.column'), cell: (c) => (c.getValue() === '(row)' ? t('report.wholeRow') : c.getValue()) }),
        column.accessor((i) => issueValue(i, upload, units, format), {
          id: 'value',
          header: t('report.value'),
          cell: (c) => <code className="font-mono text-sm break-all">{c.getValue() ?? ''}</code>,
        }),
        column.accessor('severity', {
          header: t('report.outcome'),
          cell: (c) => {
            // The report is what the upload found; a held day since confirmed or corrected is in use now.
            const resolved = c.getValue() === 'held' && c.row.original.stored != null && !c.row.original.stored.held;
            const bold = !resolved && (c.getValue() === 'rejected' || c.getValue() === 'held');
            return <span className={bold ? 'font-bold' : undefined}>{t(resolved ? 'report.severity.heldResolved' : `report.severity.${c.getValue()}`)}</span>;
          },
        }),
        column.accessor((i) => issueReason(i, units, format, t, i18n.language), {
          id: 'reason',
          header: t('report.reason'),
          cell: (c) => {
            const { text, detail } = c.getValue();
            return (
              <>
                {text}
                {detail ? <span className="block text-xs text-ink-muted">{t('report.serverDetail', { reason: detail })}</span> : null}
              </>
            );
          },
        }),
        column.display({
          id: 'fix',
          header: t('report.fix'),
          cell: ({ row }) => {
            const i = row.original;
            if (!onFix || !i.station || !i.date || i.severity === 'filled') return null;
            const { station, date } = i;
            // A held day still held offers Confirm beside Correct (each with its own reason in the audit trail).
            return (
              <div className="flex flex-wrap gap-2">
                <button type="button" className="btn btn-secondary btn-small" onClick={() => onFix(i)}>
                  {t('report.correct')}
                </button>
                {i.severity === 'held' && i.stored?.held ? (
                  <ReasonAction
                    label={t('report.confirm')}
                    title={t('report.confirmTitle', { station, date })}
                    onAct={(reason) => confirm.mutateAsync({ station, date, reason })}
                  />
                ) : null}
              </div>
            );
          },
        }),
      ]),
    [onFix, t, i18n.language, upload, units, format, confirm],
  );
  const data = issues.data?.issues ?? [];
  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (_r, i) => String(offset + i) });
  const total = issues.data?.total ?? 0;
  return (
    <section aria-labelledby={`report-${uploadId}`} className="min-w-0 space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`report-${uploadId}`} className="section-title">
          {total ? t('report.findings', { count: total, formatted: format.number(total) }) : t('report.title')}
        </h3>
        <a className="btn btn-secondary btn-small" href={issuesCsvUrl(uploadId, units)} download>
          {t('report.download')}
        </a>
      </div>
      <DataTable table={table} caption={t('report.caption')} captionVisible={false} emptyText={t('report.empty')} />
      {total > ISSUES_PAGE ? (
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <button type="button" className="btn btn-secondary btn-small" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - ISSUES_PAGE))}>
            {t('report.previous')}
          </button>
          <span className="tabular-nums">
            {t('report.range', { from: format.number(offset + 1), to: format.number(Math.min(total, offset + ISSUES_PAGE)), total: format.number(total) })}
          </span>
          <button type="button" className="btn btn-secondary btn-small" disabled={offset + ISSUES_PAGE >= total} onClick={() => setOffset(offset + ISSUES_PAGE)}>
            {t('report.next')}
          </button>
        </div>
      ) : null}
    </section>
  );
}
