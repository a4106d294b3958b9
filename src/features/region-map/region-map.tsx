import { lazy, Suspense, useId, useMemo } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { LadderRow } from '../../../shared/api/board.schema';
import { FormMessage } from '../../components/form';
import { TierSwatch } from '../ladder/components/tier-badge';
import { useLadderWords } from '../ladder/ladder-format';
import { useBoundaries } from './api/boundaries.api';
import { errorText } from '../../lib/error-text';

// ECharts arrives with this chunk only: the Ladder's text and table show before it, and sign-in never loads it.
/** Up to this many districts the list under the map shows open; beyond it, it folds into a <details>. */
const LIST_OPEN_UP_TO = 60;

const RegionMapChart = lazy(() => import('./region-map-chart'));

/**
 * The region map beside the Ladder: districts shaded by tier, each tier with its word. The drawing is for
 * the eye; the list under it gives every district as a link (keyboard and screen readers), and the Ladder
 * table is the same data as a table.
 */
export function RegionMap({ rows, only }: { rows: LadderRow[]; only?: LadderRow[] }) {
  const id = useId();
  const { t, i18n } = useTranslation('region-map');
  const words = useLadderWords();
  const all = useBoundaries();
  // With a region chosen on the Ladder, the map draws (and zooms to) that region's districts only.
  const boundaries = useMemo(() => {
    if (!only || !all.data) return all;
    const keep = new Set(only.map((r) => r.districtId));
    return { ...all, data: { ...all.data, features: all.data.features.filter((f) => keep.has(f.id)) } };
  }, [all, only]);
  const byId = useMemo(() => new Map(rows.map((r) => [r.districtId, r])), [rows]);
  const listed = useMemo(
    () =>
      (boundaries.data?.features ?? [])
        .map((f) => ({ id: f.id, name: f.properties.name, code: f.properties.code, row: byId.get(f.id) }))
        .sort((a, b) => a.name.localeCompare(b.name, i18n.language)),
    [boundaries.data, byId, i18n.language],
  );

  const districtList = (
    <ul className="map-district-list" aria-label={t('listTitle')} data-testid="map-district-list">
      {listed.map((d) => {
        const mark = d.row ? words.confidence(d.row.confidence) : null;
        return (
          <li key={d.id}>
            <Link to={`/districts/${d.id}`} className="map-district-link">
              {d.row ? <TierSwatch tier={d.row.tier} /> : <span aria-hidden="true" className="tier-swatch is-empty" />}
              <span className="min-w-0 flex-1 truncate">{d.name}</span>
              <span className="text-xs text-ink-muted">
                {d.row ? words.tier(d.row.tier) : t('noTier')}
                {mark ? ` (${mark})` : ''}
              </span>
            </Link>
          </li>
        );
      })}
    </ul>
  );

  return (
    <section aria-labelledby={`${id}-title`} className="card region-map">
      <h2 id={`${id}-title`} className="section-title">
        {t('title')}
      </h2>
      <p className="mt-1 text-sm text-ink-muted">{t('lead', { lowest: words.tier('baseline'), highest: words.tier('critical') })}</p>
      {boundaries.isPending ? (
        <p className="chart-empty">{t('loading')}</p>
      ) : boundaries.isError ? (
        <FormMessage kind="error">{errorText(boundaries.error)}</FormMessage>
      ) : boundaries.data.features.length === 0 ? (
        <p className="chart-empty">{t('noBoundaries')}</p>
      ) : (
        <div className="region-map-body mt-3">
          <div
            className="chart-box"
            role="img"
            aria-label={t('mapLabel', { count: listed.length, total: words.count(listed.length) })}
            data-testid="region-map"
          >
            <Suspense fallback={<p className="chart-empty">{t('loading')}</p>}>
              <RegionMapChart boundaries={boundaries.data} rows={rows} />
            </Suspense>
          </div>
          <div>
          <h3 id={`${id}-list`} className="text-sm font-bold">
            {t('listTitle')}
          </h3>
          <p className="text-xs text-ink-muted">{t('listHint')}</p>
          {listed.length > LIST_OPEN_UP_TO ? (
            // At national scale (3,000 districts) the list folds away so the page stays short; the Ladder table has every district too.
            <details className="mt-1">
              <summary className="link cursor-pointer text-sm">{t('listTitle')}</summary>
              {districtList}
            </details>
          ) : (
            districtList
          )}
          </div>
        </div>
      )}
    </section>
  );
}
