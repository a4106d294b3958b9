import { useState, type KeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import type { GridResponse, GridRow, WeekRef } from '../../../../shared/api/cases.schema';
import { useSession } from '../../../app/session';
import { FormMessage } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { formErrorText } from '../../../lib/form-errors';
import { useCloseWeek } from '../api/close-week.api';
import { useReopenWeek } from '../api/reopen-week.api';
import { usePutCount } from '../api/put-count.api';
import { useVoidCount } from '../api/void-count.api';
import { VoidAction } from '../../../components/void-dialog';
import { useCaseFormat } from '../case-format';
import { RevisionHistory } from './revision-history';
import './case-grid.css';
import { mayIn } from '../../../../shared/permissions';
import type { Role } from '../../../../shared/roles';

type Selected = { row: GridRow; index: number; pending?: number };

/**
 * The last twelve weeks of one disease, a row per district. An epidemiologist types into the cells of
 * their own districts: a new count is saved on Enter or when the cell is left; changing a recorded count
 * or anything in a closed week opens the correction panel below, which asks for the reason.
 */
export function CaseGrid({ grid, today }: { grid: GridResponse; today: string }) {
  const { t, weekLabel, weekSpan, formatShare } = useCaseFormat();
  const me = useSession();
  const put = usePutCount();
  const [selected, setSelected] = useState<Selected | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  // A saved correction closes its panel, so its confirmation is shown here, under the grid.
  const [saved, setSaved] = useState<string | null>(null);
  // Bumped when the panel closes, so a correction typed but not saved goes back to the recorded value.
  const [epoch, setEpoch] = useState(0);

  const save = async (row: GridRow, index: number, raw: string) => {
    const cell = row.cells[index];
    if (raw.trim() === '') return;
    const cases = Number(raw);
    if (!Number.isInteger(cases) || cases < 0) {
      setSelected({ row, index });
      setProblem(t('grid.notWhole', { cell: `${row.district.code} ${weekLabel(cell)}` }));
      return;
    }
    if (!cell.count?.voided && cell.count?.cases === cases) return;
    if (cell.count || cell.closed) {
      setSelected({ row, index, pending: cases });
      setProblem(null);
      return;
    }
    setProblem(null);
    try {
      await put.mutateAsync({ districtId: row.district.id, body: { diseaseId: grid.disease.id, year: cell.year, week: cell.week, cases, source: 'grid' } });
    } catch (error) {
      setSelected({ row, index });
      setProblem(formErrorText(error));
    }
  };

  return (
    <div className="space-y-4">
      <div className="table-wrap">
        <table className="data-table case-grid" aria-describedby="grid-help">
          <caption className="table-caption">
            {t('grid.caption', { disease: grid.disease.name, weeks: grid.weeks.length })}
          </caption>
          <thead>
            <tr>
              <th scope="col">{t('grid.district')}</th>
              {grid.weeks.map((w, i) => {
                // A week whose reporting is still open in every row the grid shows: its counts may be partial.
                const open = grid.rows.length > 0 && grid.rows.every((r) => r.cells[i]?.open);
                return (
                  <th key={`${w.year}-${w.week}`} scope="col" title={weekSpan(w)} className="text-right" data-open={open || undefined}>
                    {weekLabel(w)}
                    {open ? <span className="block text-xs font-normal text-ink-muted">{t('grid.reportingOpen')}</span> : null}
                  </th>
                );
              })}
              <th scope="col">{t('grid.onTime')}</th>
            </tr>
          </thead>
          <tbody>
            {grid.rows.map((row) => (
              <tr key={row.district.id}>
                <th scope="row" className="whitespace-nowrap text-left font-normal">
                  <Link className="link" to={`/districts/${row.district.id}/cases?disease=${grid.disease.code}`}>
                    {row.district.code} {row.district.name}
                  </Link>
                </th>
                {row.cells.map((cell, index) => {
                  const label = `${row.district.code} ${weekLabel(cell)}`;
                  const marks = [cell.closed ? t('grid.closed') : null, cell.count?.late ? t('grid.late') : null, cell.count?.voided ? t('grid.voided') : null].filter(Boolean).join(', ');
                  const future = grid.weeks[index].start > today;
                  return (
                    <td key={`${cell.year}-${cell.week}`} className="text-right tabular-nums" data-closed={cell.closed || undefined}>
                      {row.editable && !future ? (
                        <input
                          key={`${cell.count?.id ?? 'new'}-${cell.count?.version ?? 0}-${epoch}`}
                          aria-label={marks ? t('grid.cellLabelMarks', { cell: label, marks }) : t('grid.cellLabel', { cell: label })}
                          className={`input w-16 px-1 py-0.5 text-right${cell.count ? '' : ' case-cell-empty'}`}
                          placeholder="—"
                          type="text"
                          inputMode="numeric"
                          defaultValue={cell.count?.voided ? '' : (cell.count?.cases ?? '')}
                          onFocus={() => {
                            setSelected({ row, index });
                            setSaved(null);
                          }}
                          onBlur={(e) => void save(row, index, e.currentTarget.value)}
                          onKeyDown={(e: KeyboardEvent<HTMLInputElement>) => {
                            if (e.key === 'Enter') e.currentTarget.blur();
                          }}
                        />
                      ) : (
                        <button type="button" className="btn-quiet tabular-nums" aria-label={t(marks ? 'grid.readLabelMarks' : 'grid.readLabel', { cell: label, cases: cell.count?.cases ?? t('grid.noReport'), marks })} onClick={() => setSelected({ row, index })}>
                          {cell.count?.voided ? <s>{cell.count.cases}</s> : cell.count ? cell.count.cases : <span className="text-ink-muted" aria-hidden="true">—</span>}
                        </button>
                      )}
                      {marks ? <span className="block text-xs text-ink-muted">{marks}</span> : null}
                    </td>
                  );
                })}
                <td className="tabular-nums" title={t('grid.onTimeTitle', { onTime: row.completeness.onTime, expected: row.completeness.expected })}>
                  {formatShare(row.completeness.share)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p id="grid-help" className="text-sm text-ink-muted">
        {t('grid.help')} {t('grid.emptyLegend')}
      </p>
      {problem ? <FormMessage kind="error">{problem}</FormMessage> : null}
      {saved ? <FormMessage kind="success">{saved}</FormMessage> : null}
      {selected ? (
        <CellPanel
          key={`${selected.row.district.id}-${selected.index}-${selected.pending ?? ''}`}
          grid={grid}
          selected={selected}
          week={grid.weeks[selected.index]}
          today={today}
          role={me.role}
          onSaved={setSaved}
          onDone={() => {
            setSelected(null);
            setEpoch((e) => e + 1);
          }}
        />
      ) : null}
    </div>
  );
}

function CellPanel({
  grid,
  selected,
  week,
  today,
  role,
  onDone,
  onSaved,
}: {
  grid: GridResponse;
  selected: Selected;
  week: WeekRef;
  today: string;
  role: Role;
  onDone: () => void;
  onSaved: (text: string) => void;
}) {
  const { t, weekLabel, weekSpan } = useCaseFormat();
  const { row, index, pending } = selected;
  const cell = row.cells[index];
  const put = usePutCount();
  const voidCount = useVoidCount();
  const close = useCloseWeek();
  const reopen = useReopenWeek();
  const [reason, setReason] = useState('');
  /** Closing asks first; reopening asks for a reason. */
  const [confirming, setConfirming] = useState<'close' | 'reopen' | null>(null);
  const [reopenReason, setReopenReason] = useState('');
  const [showHistory, setShowHistory] = useState(false);
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const canReadHistory = mayIn(role, 'cases.readHistory', row.editable);
  const mayClose = mayIn(role, 'cases.closeWeek', row.editable);
  const canClose = mayClose && !cell.closed && week.end < today;
  const canReopen = mayClose && cell.closed;

  const correct = async () => {
    if (pending === undefined) return;
    try {
      await put.mutateAsync({
        districtId: row.district.id,
        body: { diseaseId: grid.disease.id, year: cell.year, week: cell.week, cases: pending, reason, source: 'grid' },
      });
      onSaved(t('grid.savedCases', { cases: pending }));
      onDone();
    } catch (error) {
      setMessage({
        kind: 'error',
        text: isApiError(error) && error.fields.some((f) => f.path.endsWith('reason')) ? t('grid.giveReason') : formErrorText(error),
      });
    }
  };

  const closeWeek = async () => {
    try {
      await close.mutateAsync({ districtId: row.district.id, week: { year: cell.year, week: cell.week } });
      setConfirming(null);
      setMessage({ kind: 'success', text: t('grid.isClosed', { week: weekLabel(cell), district: row.district.name }) });
    } catch (error) {
      setMessage({ kind: 'error', text: formErrorText(error) });
    }
  };

  const reopenWeek = async () => {
    try {
      const r = await reopen.mutateAsync({ districtId: row.district.id, week: { year: cell.year, week: cell.week, reason: reopenReason } });
      setConfirming(null);
      setReopenReason('');
      setMessage({ kind: 'success', text: r.reopened ? t('grid.isReopened', { week: weekLabel(cell), district: row.district.name }) : t('grid.wasOpen') });
    } catch (error) {
      setMessage({
        kind: 'error',
        text: isApiError(error) && error.fields.some((f) => f.path.endsWith('reason')) ? t('grid.giveReopenReason') : formErrorText(error),
      });
    }
  };

  return (
    <section className="card space-y-3" aria-labelledby="cell-panel-title">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="cell-panel-title" className="font-bold">
          {row.district.code} {row.district.name} · {weekLabel(cell)} ({weekSpan(week)})
        </h3>
        <button type="button" className="btn btn-secondary btn-small" onClick={onDone}>
          {t('grid.closePanel')}
        </button>
      </div>
      <p className="text-sm">
        {cell.count
          ? t(cell.count.late ? 'grid.recordedLate' : 'grid.recorded', { cases: cell.count.cases, version: cell.count.version })
          : t('grid.noCount')}{' '}
        {cell.closed ? t('grid.weekClosed') : t('grid.weekOpen')}
      </p>
      {cell.count?.voided ? <p className="text-sm font-bold">{t('grid.voidedBecause', { reason: cell.count.voided.reason })}</p> : null}
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      {pending !== undefined ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            void correct();
          }}
        >
          <p className="text-sm font-bold">
            {cell.count ? t('grid.correctTo', { from: cell.count.cases, to: pending }) : t('grid.enterClosed', { cases: pending })}
          </p>
          <div className="field">
            <label htmlFor="correction-reason" className="field-label">
              {t('grid.reason')}
            </label>
            <input id="correction-reason" className="input" value={reason} onChange={(e) => setReason(e.currentTarget.value)} required minLength={3} />
          </div>
          <button type="submit" className="btn btn-primary btn-small" disabled={put.isPending}>
            {put.isPending ? t('grid.saving') : t('grid.saveCorrection')}
          </button>
        </form>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {cell.count && canReadHistory ? (
          <button type="button" className="btn btn-secondary btn-small" aria-expanded={showHistory} onClick={() => setShowHistory((v) => !v)}>
            {showHistory ? t('grid.hideHistory') : t('grid.showHistory')}
          </button>
        ) : null}
        {row.editable && cell.count && !cell.count.voided ? (
          <VoidAction what={t('grid.voidWhat', { cell: `${row.district.code} ${weekLabel(cell)}`, cases: cell.count.cases })} onVoid={(reason) => voidCount.mutateAsync({ countId: cell.count!.id, reason })} />
        ) : null}
        {canClose && confirming !== 'close' ? (
          <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming('close')}>
            {t('grid.closeWeek', { week: weekLabel(cell), district: row.district.code })}
          </button>
        ) : null}
        {canReopen && confirming !== 'reopen' ? (
          <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming('reopen')}>
            {t('grid.reopenWeek', { week: weekLabel(cell), district: row.district.code })}
          </button>
        ) : null}
      </div>
      {canClose && confirming === 'close' ? (
        <div role="group" aria-labelledby="close-confirm" className="notice notice-info space-y-2">
          <p id="close-confirm" className="text-sm">
            {t('grid.confirmClose', { week: weekLabel(cell), district: row.district.name })}
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-primary btn-small" onClick={() => void closeWeek()} disabled={close.isPending}>
              {t('grid.confirmCloseButton')}
            </button>
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming(null)}>
              {t('grid.cancel')}
            </button>
          </div>
        </div>
      ) : null}
      {canReopen && confirming === 'reopen' ? (
        <form
          className="notice notice-info space-y-2"
          aria-labelledby="reopen-title"
          onSubmit={(e) => {
            e.preventDefault();
            void reopenWeek();
          }}
        >
          <p id="reopen-title" className="text-sm">
            {t('grid.reopenExplain', { week: weekLabel(cell), district: row.district.name })}
          </p>
          <div className="field">
            <label htmlFor="reopen-reason" className="field-label">
              {t('grid.reopenReason')}
            </label>
            <input id="reopen-reason" className="input" value={reopenReason} onChange={(e) => setReopenReason(e.currentTarget.value)} required minLength={3} />
          </div>
          <div className="flex flex-wrap gap-2">
            <button type="submit" className="btn btn-primary btn-small" disabled={reopen.isPending}>
              {t('grid.confirmReopenButton')}
            </button>
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming(null)}>
              {t('grid.cancel')}
            </button>
          </div>
        </form>
      ) : null}
      {showHistory && cell.count ? <RevisionHistory countId={cell.count.id} /> : null}
    </section>
  );
}
