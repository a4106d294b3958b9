import { lazy, Suspense, useId, useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { LadderRow } from '../../../shared/api/board.schema';
import { TIER_LABELS } from '../../../shared/tier';
import { FormMessage } from '../../components/form';
import { TierSwatch } from '../ladder/components/tier-badge';
import { CONFIDENCE_MARKS } from '../ladder/ladder-format';
import { useBoundaries } from './api/boundaries.api';

// ECharts arrives with this chunk only: the Ladder's text and table show before it, and sign-in never loads it.
const RegionMapChart = lazy(() => import('./region-map-chart'));

/**
 * The region map beside the Ladder: districts shaded by tier, each tier with its word. The drawing is for
 * the eye; the list under it gives every district as a link (keyboard and screen readers), and the Ladder
 * table is the same data as a table.
 */
export function RegionMap({ rows }: { rows: LadderRow[] }) {
  const id = useId();
  const boundaries = useBoundaries();
  const byId = useMemo(() => new Map(rows.map((r) => [r.districtId, r])), [rows]);
  const listed = useMemo(
    () =>
      (boundaries.data?.features ?? [])
        .map((f) => ({ id: f.id, name: f.properties.name, code: f.properties.code, row: byId.get(f.id) }))
        .sort((a, b) => a.name.localeCompare(b.name)),
    [boundaries.data, byId],
  );

  return (
    <section aria-labelledby={`${id}-title`} className="card region-map">
      <h2 id={`${id}-title`} className="section-title">
        Region map
      </h2>
      <p className="mt-1 text-sm text-ink-muted">
        Districts shaded by this week’s tier, pale for Baseline to dark for Critical. Select a district to open its
        District file. The Ladder table beside it holds the same tiers as a table.
      </p>
      {boundaries.isPending ? (
        <p className="chart-empty">Loading the map…</p>
      ) : boundaries.isError ? (
        <FormMessage kind="error">{boundaries.error.message}</FormMessage>
      ) : boundaries.data.features.length === 0 ? (
        <p className="chart-empty">No district has a boundary yet. An admin adds them on the Districts screen.</p>
      ) : (
        <>
          <div
            className="chart-box mt-3"
            role="img"
            aria-label={`Map of ${listed.length} districts shaded by tier. The list below gives each district with its tier.`}
            data-testid="region-map"
          >
            <Suspense fallback={<p className="chart-empty">Loading the map…</p>}>
              <RegionMapChart boundaries={boundaries.data} rows={rows} />
            </Suspense>
          </div>
          <h3 className="mt-4 text-sm font-bold">Districts on the map</h3>
          <ul className="map-district-list" aria-label="Districts on the map">
            {listed.map((d) => {
              const mark = d.row ? CONFIDENCE_MARKS[d.row.confidence] : null;
              return (
                <li key={d.id}>
                  <Link to={`/districts/${d.id}`} className="map-district-link">
                    {d.row ? <TierSwatch tier={d.row.tier} /> : <span aria-hidden="true" className="tier-swatch is-empty" />}
                    <span className="min-w-0 flex-1 truncate">{d.name}</span>
                    <span className="text-xs text-ink-muted">
                      {d.row ? TIER_LABELS[d.row.tier] : 'no tier yet'}
                      {mark ? ` (${mark})` : ''}
                    </span>
                  </Link>
                </li>
              );
            })}
          </ul>
        </>
      )}
    </section>
  );
}
