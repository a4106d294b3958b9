import { Link } from 'react-router-dom';
import type { FlagDto } from '../../../../shared/api/flags.schema';
import { driverShares } from '../../../../shared/tier/driver-shares';
import { useFormat } from '../../../i18n/format';
import { TierBadge } from '../../ladder/components/tier-badge';
import { useFlagFormat } from '../flag-format';
import { useRenderMessage } from '../message';

/**
 * What a supervisor needs to decide: district, the tier that raised the flag beside the district's tier
 * now, the flag's week, whether it is superseded or lapsed, why (the internal note), the drivers at the
 * time (shares from the one driverShares), the message and the actions.
 */
export function FlagSummary({ flag, linkToPage = false }: { flag: FlagDto; linkToPage?: boolean }) {
  const f = useFlagFormat();
  const { t } = f;
  const { percent } = useFormat();
  const render = useRenderMessage();
  const shares = driverShares(flag.drivers);
  const status = f.statusLabel(flag);
  const waiting = flag.status === 'open' || flag.status === 'lapsed';
  // Waiting: what approving would send now; decided: what was approved (a person's words as written).
  const message = waiting ? render(flag.proposal) : flag.finalComposed ? render(flag.finalComposed) : (flag.finalMessage ?? render(flag.message));
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
        <span className="status" data-testid="flag-status">{status}</span>
      </div>
      <dl className="grid grid-cols-[auto_1fr] items-center gap-x-3 gap-y-1 text-sm" data-testid="flag-tiers">
        <dt className="font-bold">{t('summary.tierAtFlag')}</dt>
        <dd className="flex flex-wrap items-center gap-2">
          {flag.tier ? <TierBadge tier={flag.tier} /> : <span className="text-ink-muted">{t('summary.noTier')}</span>}
          {flag.epiWeek && flag.epiYear ? <span>{t('summary.week', { week: flag.epiWeek, year: flag.epiYear })}</span> : null}
        </dd>
        <dt className="font-bold">{t('summary.tierNow')}</dt>
        <dd className="flex flex-wrap items-center gap-2">
          {flag.current ? (
            <>
              <TierBadge tier={flag.current.tier} />
              <span>{t('summary.nowWeek', { week: flag.current.epiWeek, year: flag.current.epiYear })}</span>
            </>
          ) : (
            <span className="text-ink-muted">{t('summary.noTierNow')}</span>
          )}
        </dd>
      </dl>
      <p className="text-sm text-ink-muted">
        {[
          f.reasonLabel(flag),
          t('summary.raised', { who: f.raisedByLabel(flag), when: f.formatWhen(flag.createdAt) }),
          flag.status === 'open' && flag.lapsesAt ? t('summary.lapsesOn', { when: f.formatWhen(flag.lapsesAt) }) : null,
        ]
          .filter(Boolean)
          .join(' · ')}
      </p>
      {flag.status === 'lapsed' ? (
        <p className="border-l-4 border-line pl-3 text-sm font-bold" role="note">{t('summary.lapsed')}</p>
      ) : flag.superseded ? (
        <p className="border-l-4 border-line pl-3 text-sm font-bold" role="note">{t('summary.superseded')}</p>
      ) : null}
      {flag.note ? <p className="text-sm">{t('summary.why', { note: flag.note })}</p> : null}
      {shares.length ? (
        <p className="text-sm">
          {t('summary.drivers', {
            list: shares.map((d) => t('summary.driverShare', { label: f.driverLabel({ id: d.id, label: d.id }), share: percent(d.share) })).join(' · '),
          })}
        </p>
      ) : null}
      <div>
        <h3 className="text-sm font-bold">{flag.publicMessage ? t('summary.publicMessage') : t('summary.messageHeading')}</h3>
        <blockquote className="border-l-4 border-line pl-3" data-testid="flag-message">{message}</blockquote>
      </div>
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
      {!waiting ? (
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
