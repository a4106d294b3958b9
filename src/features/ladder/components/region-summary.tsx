import { useId } from 'react';
import { Link } from 'react-router-dom';
import { TIERS } from '../../../../shared/tier';
import { tierChangeArrow, useLadderWords } from '../ladder-format';
import type { RegionGroup } from '../region-groups';
import { TierSwatch } from './tier-badge';

/**
 * The region summary above the Ladder: per region, the districts in each tier this week, how many moved
 * up or down, and the largest changes since last week. A region's name filters the Ladder to it.
 */
export function RegionSummary({ groups, onChoose }: { groups: RegionGroup[]; onChoose: (regionId: string) => void }) {
  const id = useId();
  const words = useLadderWords();
  const { t } = words;
  return (
    <section aria-labelledby={`${id}-title`} className="card" data-testid="region-summary">
      <h2 id={`${id}-title`} className="section-title">
        {t('region.summaryTitle')}
      </h2>
      <p className="mt-1 text-sm text-ink-muted">{t('region.summaryLead')}</p>
      <div className="table-wrap mt-3">
        <table className="data-table region-summary-table">
          <caption className="sr-only">{t('region.summaryTitle')}</caption>
          <thead>
            <tr>
              <th scope="col">{t('region.columns.region')}</th>
              <th scope="col">{t('region.columns.districts')}</th>
              {TIERS.map((tier) => (
                <th key={tier} scope="col">
                  <span className="inline-flex items-center gap-1">
                    <TierSwatch tier={tier} />
                    {words.tier(tier)}
                  </span>
                </th>
              ))}
              <th scope="col">{t('region.columns.noTier')}</th>
              <th scope="col">{t('region.columns.changes')}</th>
            </tr>
          </thead>
          <tbody>
            {groups.map((g) => (
              <tr key={g.id ?? 'none'} data-region={g.code ?? ''}>
                <th scope="row">
                  {g.id ? (
                    <button type="button" className="link text-left" onClick={() => onChoose(g.id!)}>
                      {g.name}
                    </button>
                  ) : (
                    <button type="button" className="link text-left" onClick={() => onChoose('none')}>
                      {t('region.none')}
                    </button>
                  )}
                </th>
                <td className="tabular-nums">{words.count(g.districts)}</td>
                {TIERS.map((tier) => (
                  <td key={tier} className="tabular-nums">
                    {words.count(g.perTier[tier])}
                  </td>
                ))}
                <td className="tabular-nums">{words.count(g.noTier)}</td>
                <td>
                  <span className="block text-xs text-ink-muted">{t('region.movedLine', { up: words.count(g.up), down: words.count(g.down) })}</span>
                  {g.largestChanges.length === 0 ? (
                    <span className="text-xs text-ink-muted">{t('region.noChanges')}</span>
                  ) : (
                    <ul className="text-sm">
                      {g.largestChanges.map((r) => (
                        <li key={r.districtId}>
                          <Link to={`/districts/${r.districtId}`} className="link">
                            {r.name}
                          </Link>{' '}
                          <span aria-hidden="true">{tierChangeArrow(r.tierChange)}</span> {words.change(r.tierChange)}
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
