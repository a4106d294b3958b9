import { useState, type KeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import type { GridResponse, GridRow, WeekRef } from '../../../../shared/api/cases.schema';
import { useSession } from '../../../app/session';
import { FormMessage } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { useCloseWeek } from '../api/close-week.api';
import { usePutCount } from '../api/put-count.api';
import { formatShare, weekLabel, weekSpan } from '../case-format';
import { RevisionHistory } from './revision-history';

type Selected = { row: GridRow; index: number; pending?: number };

/**
 * The last twelve weeks of one disease, a row per district. An epidemiologist types into the cells of
 * their own districts: a new count is saved on Enter or when the cell is left; changing a recorded count
 * or anything in a closed week opens the correction panel below, which asks for the reason.
 */
export function CaseGrid({ grid, today }: { grid: GridResponse; today: string }) {
  const me = useSession();
  const put = usePutCount();
  const [selected, setSelected] = useState<Selected | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  // Bumped when the panel closes, so a correction typed but not saved goes back to the recorded value.
  const [epoch, setEpoch] = useState(0);

  const save = async (row: GridRow, index: number, raw: string) => {
    const cell = row.cells[index];
    if (raw.trim() === '') return;
    const cases = Number(raw);
    if (!Number.isInteger(cases) || cases < 0) {
      setSelected({ row, index });
      setProblem(`Cases for ${row.district.code} ${weekLabel(cell)} must be a whole number, 0 or more.`);
      return;
    }
    if (cell.count?.cases === cases) return;
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
            {grid.disease.name}: weekly cases, last {grid.weeks.length} weeks
          </caption>
          <thead>
            <tr>
              <th scope="col">District</th>
              {grid.weeks.map((w) => (
                <th key={`${w.year}-${w.week}`} scope="col" title={weekSpan(w)} className="text-right">
                  {weekLabel(w)}
                </th>
              ))}
              <th scope="col">On time</th>
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
                  const marks = [cell.closed ? 'closed' : null, cell.count?.late ? 'late' : null].filter(Boolean).join(', ');
                  const future = grid.weeks[index].start > today;
                  return (
                    <td key={`${cell.year}-${cell.week}`} className="text-right tabular-nums" data-closed={cell.closed || undefined}>
                      {row.editable && !future ? (
                        <input
                          key={`${cell.count?.id ?? 'new'}-${cell.count?.version ?? 0}-${epoch}`}
                          aria-label={`Cases ${label}${marks ? ` (${marks})` : ''}`}
                          className="input w-16 px-1 py-0.5 text-right"
                          type="text"
                          inputMode="numeric"
                          defaultValue={cell.count?.cases ?? ''}
                          onFocus={() => setSelected({ row, index })}
                          onBlur={(e) => void save(row, index, e.currentTarget.value)}
                          onKeyDown={(e: KeyboardEvent<HTMLInputElement>) => {
                            if (e.key === 'Enter') e.currentTarget.blur();
                          }}
                        />
                      ) : (
                        <button type="button" className="btn-quiet tabular-nums" aria-label={`${label}: ${cell.count?.cases ?? 'no report'}${marks ? ` (${marks})` : ''}`} onClick={() => setSelected({ row, index })}>
                          {cell.count?.cases ?? '–'}
                        </button>
                      )}
                      {marks ? <span className="block text-xs text-ink-muted">{marks}</span> : null}
                    </td>
                  );
                })}
                <td className="tabular-nums" title={`${row.completeness.onTime} of ${row.completeness.expected} weekly reports on time`}>
                  {formatShare(row.completeness.share)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p id="grid-help" className="text-sm text-ink-muted">
        Type a count and press Enter. Changing a recorded count is a correction and asks for a reason; a closed week changes only that way.
        “On time” is the share of due weekly reports received by the deadline.
      </p>
      {problem ? <FormMessage kind="error">{problem}</FormMessage> : null}
      {selected ? (
        <CellPanel
          key={`${selected.row.district.id}-${selected.index}-${selected.pending ?? ''}`}
          grid={grid}
          selected={selected}
          week={grid.weeks[selected.index]}
          today={today}
          role={me.role}
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
}: {
  grid: GridResponse;
  selected: Selected;
  week: WeekRef;
  today: string;
  role: string;
  onDone: () => void;
}) {
  const { row, index, pending } = selected;
  const cell = row.cells[index];
  const put = usePutCount();
  const close = useCloseWeek();
  const [reason, setReason] = useState('');
  const [showHistory, setShowHistory] = useState(false);
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const canReadHistory = role === 'admin' || role === 'supervisor' || row.editable;
  const canClose = (role === 'supervisor' || row.editable) && !cell.closed && week.end < today;

  const correct = async () => {
    if (pending === undefined) return;
    try {
      await put.mutateAsync({
        districtId: row.district.id,
        body: { diseaseId: grid.disease.id, year: cell.year, week: cell.week, cases: pending, reason, source: 'grid' },
      });
      setMessage({ kind: 'success', text: `Saved: ${pending} cases.` });
      onDone();
    } catch (error) {
      setMessage({ kind: 'error', text: formErrorText(error).replace('Some fields need attention; see the messages beside them.', 'Give the reason for the correction.') });
    }
  };

  const closeWeek = async () => {
    try {
      await close.mutateAsync({ districtId: row.district.id, week: { year: cell.year, week: cell.week } });
      setMessage({ kind: 'success', text: `${weekLabel(cell)} is closed for ${row.district.name}.` });
    } catch (error) {
      setMessage({ kind: 'error', text: formErrorText(error) });
    }
  };

  return (
    <section className="card space-y-3" aria-labelledby="cell-panel-title">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="cell-panel-title" className="font-bold">
          {row.district.code} {row.district.name} · {weekLabel(cell)} ({weekSpan(week)})
        </h3>
        <button type="button" className="btn btn-secondary btn-small" onClick={onDone}>
          Close panel
        </button>
      </div>
      <p className="text-sm">
        {cell.count ? `${cell.count.cases} cases recorded (version ${cell.count.version}${cell.count.late ? ', received late' : ''}).` : 'No count recorded.'}{' '}
        {cell.closed ? 'This week is closed: it changes only through a correction with a reason.' : 'This week is open.'}
      </p>
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
            {cell.count ? `Correct ${cell.count.cases} to ${pending}` : `Enter ${pending} in a closed week`}
          </p>
          <div className="field">
            <label htmlFor="correction-reason" className="field-label">
              Reason for the correction
            </label>
            <input id="correction-reason" className="input" value={reason} onChange={(e) => setReason(e.currentTarget.value)} required minLength={3} />
          </div>
          <button type="submit" className="btn btn-primary btn-small" disabled={put.isPending}>
            {put.isPending ? 'Saving…' : 'Save the correction'}
          </button>
        </form>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {cell.count && canReadHistory ? (
          <button type="button" className="btn btn-secondary btn-small" aria-expanded={showHistory} onClick={() => setShowHistory((v) => !v)}>
            {showHistory ? 'Hide the revision history' : 'Show the revision history'}
          </button>
        ) : null}
        {canClose ? (
          <button type="button" className="btn btn-secondary btn-small" onClick={() => void closeWeek()} disabled={close.isPending}>
            Close {weekLabel(cell)} for {row.district.code}
          </button>
        ) : null}
      </div>
      {showHistory && cell.count ? <RevisionHistory countId={cell.count.id} /> : null}
    </section>
  );
}
