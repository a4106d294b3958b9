import { Link } from 'react-router-dom';
import type { FlagDto } from '../../../../shared/api/flags.schema';
import { TierBadge } from '../../ladder/components/tier-badge';
import { formatWhen, raisedByLabel, reasonLabel, statusLabel } from '../flag-format';

/** What a supervisor needs to decide: district, tier, why, the drivers at the time, the message and the actions. */
export function FlagSummary({ flag, linkToPage = false }: { flag: FlagDto; linkToPage?: boolean }) {
  const drivers = [...flag.drivers].filter((d) => d.score !== null).sort((a, b) => b.contribution - a.contribution);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="section-title !mb-0">
          {linkToPage ? (
            <Link className="link" to={`/flags/${flag.id}`}>
              {flag.districtName} ({flag.districtCode})
            </Link>
          ) : (
            `${flag.districtName} (${flag.districtCode})`
          )}
        </h2>
        {flag.tier ? <TierBadge tier={flag.tier} /> : <span className="text-sm text-ink-muted">No tier yet</span>}
        <span className="status">{statusLabel(flag)}</span>
      </div>
      <p className="text-sm text-ink-muted">
        {reasonLabel(flag)}
        {flag.epiWeek ? ` · week ${flag.epiWeek} of ${flag.epiYear}` : ''} · raised by {raisedByLabel(flag)} on {formatWhen(flag.createdAt)}
      </p>
      {flag.note ? <p className="text-sm">Why: {flag.note}</p> : null}
      {drivers.length ? (
        <p className="text-sm">
          Drivers at the time:{' '}
          {drivers.map((d) => `${d.label} ${Math.round(d.contribution * 100)} %`).join(' · ')}
        </p>
      ) : null}
      <blockquote className="border-l-4 border-line pl-3">{flag.finalMessage ?? flag.suggestedMessage}</blockquote>
      <details>
        <summary className="cursor-pointer text-sm font-bold">Suggested actions ({flag.actions.length})</summary>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
          {flag.actions.map((a) => (
            <li key={a.id}>
              <strong>{a.title}.</strong> {a.text}
            </li>
          ))}
        </ul>
        <p className="mt-2 text-sm italic">{flag.caution}</p>
      </details>
      {flag.status !== 'open' ? (
        <p className="text-sm">
          {statusLabel(flag)} by {flag.decidedBy?.displayName ?? 'someone'} on {flag.decidedAt ? formatWhen(flag.decidedAt) : '—'}
          {flag.decisionReason ? `: ${flag.decisionReason}` : ''}
        </p>
      ) : null}
    </div>
  );
}
