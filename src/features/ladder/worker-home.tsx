import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { LadderRow } from '../../../shared/api/board.schema';
import { useSession } from '../../app/session';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useAdvisories } from '../flags/api/advisories.api';
import { useRenderMessage } from '../flags/message';
import { TierBadge } from './components/tier-badge';

/**
 * A community worker's first screen on a phone: their own district (its tier this week and a way into its
 * file and surveys) and its current advisories, each with the caution; the cautions themselves one tap away.
 */
export function WorkerHome({ rows }: { rows: readonly LadderRow[] }) {
  const { t } = useTranslation('ladder');
  const me = useSession();
  const advisories = useAdvisories();
  const render = useRenderMessage();
  const mine = me.districts.map((d) => ({ district: d, row: rows.find((r) => r.districtId === d.id) ?? null }));
  const current = (advisories.data ?? []).filter((a) => a.current);
  return (
    <div className="mb-6 space-y-4" data-testid="worker-home">
      {mine.map(({ district, row }) => (
        <section key={district.id} className="card space-y-2" aria-labelledby={`home-${district.id}`}>
          <h2 id={`home-${district.id}`} className="section-title !mb-0">
            {t('worker.yourDistrict', { district: district.name })}
          </h2>
          <p className="flex flex-wrap items-center gap-2 text-sm">
            {row ? <TierBadge tier={row.tier} confidence={row.confidence} /> : <span className="text-ink-muted">{t('worker.noTier')}</span>}
          </p>
          <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
            <Link className="link inline-block py-1" to={`/districts/${district.id}`}>
              {t('worker.openFile')}
            </Link>
            <Link className="link inline-block py-1" to="/surveys">
              {t('worker.newSurvey')}
            </Link>
          </p>
        </section>
      ))}
      <section className="card space-y-2" aria-labelledby="home-advisories">
        <h2 id="home-advisories" className="section-title !mb-0">
          {t('worker.advisories', { count: current.length })}
        </h2>
        {advisories.isPending ? (
          <p className="text-sm text-ink-muted">{t('loading')}</p>
        ) : current.length === 0 ? (
          <p className="text-sm">{t('worker.noAdvisories')}</p>
        ) : (
          <ul className="space-y-3">
            {current.map((a) => (
              <li key={a.id} className="space-y-1 break-words">
                <p className="flex flex-wrap items-center gap-2 font-bold">
                  {a.districtName} {a.tier ? <TierBadge tier={a.tier} /> : null}
                </p>
                {/* In the worker's language from its code and numbers; an old hand-written one as written. */}
                <p className="text-sm">{a.composed ? render(a.composed) : a.message}</p>
                <p className="text-sm italic">{t('worker.caution')}</p>
              </li>
            ))}
          </ul>
        )}
        <Link className="link inline-block py-1 text-sm" to="/advisories">
          {t('worker.allAdvisories')}
        </Link>
      </section>
      <details className="card">
        <summary className="cursor-pointer py-1 font-bold">{t('worker.cautionsSummary')}</summary>
        <CautionsPanel className="mt-3" />
      </details>
    </div>
  );
}
