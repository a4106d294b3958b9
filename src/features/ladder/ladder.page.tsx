import { lazy, Suspense, useEffect, useId, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { may } from '../../../shared/permissions';
import { useSession } from '../../app/session';
import { CautionsDisclosure } from '../cautions/cautions-disclosure';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { FirstRunTour, TourButton, useFirstRunTour } from '../help/first-run-tour';
import { useBoard } from './api/board.api';
import { LadderTable } from './components/ladder.table';
import { RegionSummary } from './components/region-summary';
import { groupByRegion, rowsInRegionOrder, rowsOfRegion, type RegionChoice } from './region-groups';
import { useLadderWords } from './ladder-format';
import { WorkerHome } from './worker-home';
import './ladder.css';
import { errorText } from '../../lib/error-text';
import { useNearViewport } from '../../lib/use-near-viewport';

const EMPTY: never[] = [];

/**
 * The region map (and, through it, ECharts) is its own chunk, fetched once the table has painted and the map's
 * place is near the viewport: the table is what the officer reads first, so the map's code stays out of the
 * Ladder's initial JavaScript, and on a phone or tablet (under 64rem), where the map sits far below the table,
 * it is fetched only when the reader scrolls towards it. Its boundaries are already on their way (src/app/router.tsx asks for them
 * beside the board).
 */
const RegionMap = lazy(() => import('../region-map/region-map').then((m) => ({ default: m.RegionMap })));

/** True from the first frame after `ready` has been painted (a frame, then a task). */
function useAfterPaint(ready: boolean): boolean {
  const [painted, setPainted] = useState(false);
  useEffect(() => {
    if (!ready || painted) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const frame = requestAnimationFrame(() => {
      timer = setTimeout(() => setPainted(true), 0);
    });
    return () => {
      cancelAnimationFrame(frame);
      clearTimeout(timer);
    };
  }, [ready, painted]);
  return painted;
}

/** The home screen: districts ranked by this week's tier, beside the region map, with the cautions in view. */
export function LadderPage() {
  const { t, i18n } = useTranslation('ladder');
  const words = useLadderWords();
  const board = useBoard();
  const me = useSession();
  const tour = useFirstRunTour(me.id, !board.isPending);
  const allRows = board.data?.rows ?? EMPTY;
  const id = useId();
  const myRegionIds = useMemo(() => (me.regions ?? []).map((r) => r.id), [me.regions]);
  // A person scoped to regions opens the Ladder on their regions; everyone else on every district.
  const [choice, setChoice] = useState<RegionChoice>(myRegionIds.length ? 'mine' : 'all');
  const [grouped, setGrouped] = useState(false);
  const regions = useMemo(() => {
    const seen = new Map<string, { id: string; name: string }>();
    for (const r of allRows) if (r.region && !seen.has(r.region.id)) seen.set(r.region.id, { id: r.region.id, name: r.region.name });
    return [...seen.values()].sort((a, b) => a.name.localeCompare(b.name, i18n.language));
  }, [allRows, i18n.language]);
  const hasRegions = regions.length > 0;
  const someWithout = useMemo(() => allRows.some((r) => r.region === null), [allRows]);
  const chosen = useMemo(() => (hasRegions ? rowsOfRegion(allRows, choice, myRegionIds) : allRows), [allRows, choice, myRegionIds, hasRegions]);
  const rows = useMemo(() => (hasRegions && grouped ? rowsInRegionOrder(chosen, i18n.language) : chosen), [chosen, grouped, hasRegions, i18n.language]);
  const groups = useMemo(() => (hasRegions ? groupByRegion(chosen, i18n.language) : []), [chosen, hasRegions, i18n.language]);
  const tablePainted = useAfterPaint(board.isSuccess);
  const mapPlace = useRef<HTMLDivElement>(null);
  const mapNear = useNearViewport(mapPlace, tablePainted, '(min-width: 64rem)');
  const week = board.data ? words.week(board.data.epiYear, board.data.epiWeek) : null;
  const lead = board.data?.asOf
    ? t('lead', { week: week ?? t('latestWeek'), asOf: words.day(board.data.asOf), computedAt: words.dateTime(board.data.computedAt) })
    : t('leadNoData');

  return (
    <section aria-labelledby="page-title">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <PageHeading lead={lead}>{t('title')}</PageHeading>
        <TourButton onClick={tour.start} />
      </div>
      <DemoDataLabel districts={rows} />
      {me.role === 'worker' ? (
        <WorkerHome rows={rows} />
      ) : (
        <div data-tour="cautions">
          <CautionsDisclosure className="mb-6" />
        </div>
      )}
      {board.isPending ? (
        <p className="text-ink-muted">{t('loading')}</p>
      ) : board.isError ? (
        <FormMessage kind="error">{errorText(board.error)}</FormMessage>
      ) : (
        <div className="grid gap-6">
          <div className="min-w-0" data-tour="ladder-table">
            {allRows.length === 0 && may(me.role, 'seasonRuns.start') ? (
              <FormMessage kind="info">
                <Trans t={t} i18nKey="noTiersYet" components={{ run: <Link to="/season-runs" className="link" /> }} />
              </FormMessage>
            ) : null}
            {hasRegions ? <RegionSummary groups={groups} onChoose={setChoice} /> : null}
            <LadderTable
              key={grouped ? 'by-region' : 'by-rank'}
              rows={rows}
              showRegion={hasRegions}
              caption={week ? t('captionWeek', { week }) : t('caption')}
              toolbarStart={
                hasRegions ? (
                  <>
                    <div className="field min-w-[10rem]">
                      <label htmlFor={`${id}-region`} className="field-label">
                        {t('region.filterLabel')}
                      </label>
                      <select id={`${id}-region`} className="input" value={choice} onChange={(e) => setChoice(e.currentTarget.value)}>
                        <option value="all">{t('region.all')}</option>
                        {myRegionIds.length ? <option value="mine">{t('region.mine')}</option> : null}
                        {regions.map((r) => (
                          <option key={r.id} value={r.id}>
                            {r.name}
                          </option>
                        ))}
                        {someWithout ? <option value="none">{t('region.none')}</option> : null}
                      </select>
                    </div>
                    <label className="flex cursor-pointer items-center gap-2 pb-2">
                      <input type="checkbox" className="checkbox" checked={grouped} onChange={(e) => setGrouped(e.currentTarget.checked)} />
                      <span>{t('region.group')}</span>
                    </label>
                  </>
                ) : null
              }
            />
          </div>
          <div className="min-w-0" data-tour="region-map" ref={mapPlace}>
            {tablePainted && mapNear ? (
              <Suspense fallback={<RegionMapPending />}>
                <RegionMap rows={rows} only={hasRegions && choice !== 'all' ? rows : undefined} />
              </Suspense>
            ) : (
              <RegionMapPending />
            )}
          </div>
        </div>
      )}
      <FirstRunTour role={me.role} open={tour.open} onClose={tour.close} />
    </section>
  );
}

/** Where the region map will be, while its code arrives (the same card, so nothing below it jumps). */
function RegionMapPending() {
  const { t } = useTranslation('region-map');
  return (
    <section className="card region-map" aria-busy="true">
      <h2 className="section-title">{t('title')}</h2>
      <p className="chart-empty">{t('loading')}</p>
    </section>
  );
}
