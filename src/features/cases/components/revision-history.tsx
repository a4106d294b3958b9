import { FormMessage } from '../../../components/form';
import { useRevisions } from '../api/revisions.api';
import { formatDateTime } from '../case-format';

const values = (v: { cases: number; confirmed: number | null; probable: number | null } | null) =>
  v === null ? '—' : `${v.cases}${v.confirmed !== null || v.probable !== null ? ` (confirmed ${v.confirmed ?? '—'}, probable ${v.probable ?? '—'})` : ''}`;

/** Every version of one count: who, when, old, new and why. Loaded only when asked for. */
export function RevisionHistory({ countId }: { countId: string }) {
  const history = useRevisions(countId);
  if (history.isPending) return <p className="text-sm text-ink-muted">Loading the history…</p>;
  if (history.isError) return <FormMessage kind="error">{history.error.message}</FormMessage>;
  return (
    <div className="table-wrap">
      <table className="data-table" data-testid="revision-history">
        <caption className="table-caption">Revision history</caption>
        <thead>
          <tr>
            <th scope="col">Version</th>
            <th scope="col">When</th>
            <th scope="col">Who</th>
            <th scope="col">Was</th>
            <th scope="col">Became</th>
            <th scope="col">Reason</th>
          </tr>
        </thead>
        <tbody>
          {history.data.revisions.map((r) => (
            <tr key={r.version}>
              <td className="tabular-nums">
                {r.version} · {r.kind === 'entry' ? 'entered' : 'corrected'} ({r.source})
              </td>
              <td>{formatDateTime(r.at)}</td>
              <td>{r.actor?.displayName ?? (r.source === 'demo' ? 'Demo data' : 'Unknown')}</td>
              <td className="tabular-nums">{values(r.old)}</td>
              <td className="tabular-nums">{values(r.new)}</td>
              <td>{r.reason ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
