import { Link } from 'react-router-dom';
import type { FlagDto } from '../../../../shared/api/flags.schema';
import { useFormat } from '../../../i18n/format';
import { TierBadge } from '../../ladder/components/tier-badge';
import { useFlagFormat } from '../flag-format';

/** What a supervisor needs to decide: district, tier, why, the drivers at the time, the message and the actions. */
export function FlagSummary({ flag, linkToPage = false }: { flag: FlagDto; linkToPage?: boolean }) {
  const f = useFlagFormat();
  const { t } = f;
  const { percent } = useFormat();
  const drivers = [...flag.drivers].filter((d) => d.score !== null).sort((a, b) => b.contribution - a.contribution);
  const status = f.statusLabel(flag);
  return (
    <div className="min-w-0 space-y-3 break-words">
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
        {flag.tier ? <TierBadge tier={flag.tier} /> : <span className="text-sm text-ink-muted">{t('summary.noTier')}</span>}
        <span className="status">{status}</span>
      </div>
      <p className="text-sm text-ink-muted">
        {[
          f.reasonLabel(flag),
          flag.epiWeek && flag.epiYear ? t('summary.week', { week: flag.epiWeek, year: flag.epiYear }) : null,
          t('summary.raised', { who: f.raisedByLabel(flag), when: f.formatWhen(flag.createdAt) }),
        ]
          .filter(Boolean)
          .join(' · ')}
      </p>
      {flag.note ? <p className="text-sm">{t('summary.why', { note: flag.note })}</p> : null}
      {drivers.length ? (
        <p className="text-sm">
          {t('summary.drivers', {
            list: drivers.map((d) => t('summary.driverShare', { label: f.driverLabel(d), share: percent(d.contribution) })).join(' · '),
          })}
        </p>
      ) : null}
      <blockquote className="border-l-4 border-line pl-3">{flag.finalMessage ?? flag.suggestedMessage}</blockquote>
      <details>
        <summary className="cursor-pointer py-1 text-sm font-bold">{t('summary.actions', { count: flag.actions.length })}</summary>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
          {flag.actions.map((a) => {
            const action = f.action(a);
            return (
              <li key={a.id}>
                <strong>{action.title}.</strong> {action.text}
              </li>
            );
          })}
        </ul>
        <p className="mt-2 text-sm italic">{f.caution()}</p>
      </details>
      {flag.status !== 'open' ? (
        <p className="text-sm">
          {t(flag.decisionReason ? 'summary.decidedWithReason' : 'summary.decided', {
            status,
            who: flag.decidedBy?.displayName ?? t('someone'),
            when: flag.decidedAt ? f.formatWhen(flag.decidedAt) : '—',
            reason: flag.decisionReason ?? '',
          })}
        </p>
      ) : null}
    </div>
  );
}
