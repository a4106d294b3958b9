import { useMemo } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { DRIVERS } from '../../../../shared/tier';
import { SeriesTable } from '../../../components/chart/series-table';
import { FormMessage } from '../../../components/form';
import { CautionsPanel } from '../../cautions/cautions-panel';
import { DemoDataLabel } from '../../districts/components/demo-data-label';
import { useLadderWords } from '../../ladder/ladder-format';
import '../../ladder/ladder.css';
import { useDistrictFile } from '../api/district-file.api';
import { CurrentTier } from '../components/current-tier';
import { KeyNumbers } from '../components/key-numbers';
import { channelMethodText, isOpenWeekAt, profileLabel } from '../district-file-format';
import '../district-file.css';
import { PrintCasesChart, PrintDegreeDaysChart } from './print-charts';
import './district-print.css';
import { errorText } from '../../../lib/error-text';
import { useDocumentTitle } from '../../../lib/document-title';

const seasonParam = (v: string | null) => (v && /^\d{4}$/.test(v) ? Number(v) : null);

/**
 * One district on paper: its current tier and drivers, the key numbers, cases against the endemic
 * channel and heat accumulation as static drawings with their tables, the tier history, and the cautions.
 * The "Print" button calls the browser's print; print CSS leaves out the app's header and the buttons.
 * No ECharts: the drawings are plain SVG, so the page is light and prints the same everywhere.
 */
export function DistrictPrintPage() {
  const { t } = useTranslation('district-file');
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const file = useDistrictFile(id, seasonParam(search.get('season')));
  // The tab (and a PDF saved from the print dialog) is named after the district, in the interface language.
  useDocumentTitle(file.data ? `${file.data.district.name} · ${t('print.title')}` : t('print.title'));
  if (file.isPending) return <p className="text-ink-muted">{t('loading')}</p>;
  if (file.isError)
    return (
      <section aria-labelledby="page-title">
        <h1 id="page-title" className="text-2xl font-bold">
          {t('print.title')}
        </h1>
        <FormMessage kind="error">{errorText(file.error)}</FormMessage>
        <p className="mt-4">
          <Link to="/" className="link">
            {t('backToLadder')}
          </Link>
        </p>
      </section>
    );
  return <DistrictPrintView data={file.data} />;
}

const byWeek = (a: { epiYear: number; epiWeek: number }, b: { epiYear: number; epiWeek: number }) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek;

export function DistrictPrintView({ data }: { data: DistrictFileResponse }) {
  const w = useLadderWords();
  const { f } = w;
  const { t } = useTranslation('district-file');
  const { district, seasonYear } = data;
  const tiers = useMemo(() => [...data.tiers].sort(byWeek), [data.tiers]);
  const current = tiers[tiers.length - 1] ?? null;
  const previous = tiers[tiers.length - 2] ?? null;
  const printedAt = useMemo(() => new Date().toISOString(), []);
  const contribution = (x: (typeof tiers)[number], d: (typeof DRIVERS)[number]) => x.drivers.find((y) => y.id === d)?.contribution ?? 0;

  return (
    <article className="print-page" aria-labelledby="page-title">
      <div className="no-print mb-4 flex flex-wrap items-center gap-3">
        <button type="button" className="btn btn-primary" onClick={() => window.print()}>
          {t('print.button')}
        </button>
        <Link to={`/districts/${district.id}?season=${seasonYear}`} className="link">
          {t('print.back')}
        </Link>
        <p className="text-sm text-ink-muted">{t('print.hint')}</p>
      </div>

      <header className="print-header">
        <p className="text-sm font-bold uppercase tracking-wide text-ink-muted">{t('print.kicker')}</p>
        <h1 id="page-title" className="text-2xl font-bold">
          {district.name} <span className="font-mono text-base text-ink-muted">{district.code}</span>
        </h1>
        <p className="text-sm">
          {t('print.meta', { season: seasonYear, printed: f.dateTime(printedAt) })}
        </p>
        <DemoDataLabel districts={[district]} />
      </header>

      {current ? (
        <CurrentTier current={current} previous={previous} help={false} />
      ) : (
        <FormMessage kind="info">{t('noTier', { season: seasonYear })}</FormMessage>
      )}

      <div className="mt-4">
        <KeyNumbers data={data} help={false} />
      </div>

      <section className="card mt-4 print-section" aria-labelledby="print-cases">
        <h2 id="print-cases" className="section-title">
          {t('print.casesTitle')}
        </h2>
        {data.cases.length === 0 ? <p className="text-sm text-ink-muted">{t('noCases')}</p> : null}
        {data.cases.map((c) => (
          <div key={c.diseaseId} className="mt-3 print-block">
            <h3 className="font-bold">{t('cases.title', { disease: c.diseaseName })}</h3>
            <p className="text-sm text-ink-muted">{t('print.channelMethod', { method: channelMethodText(w, c.channel.method) })}</p>
            <PrintCasesChart cases={c} seasonYear={seasonYear} />
            <SeriesTable
              caption={t('cases.tableCaption', { disease: c.diseaseName })}
              header={[t('table.week'), t('cases.series.cases', { year: seasonYear }), t('cases.series.lower'), t('cases.series.centre'), t('cases.series.upper'), t('print.zoneColumn')]}
              rows={c.weeks.map((wk, i) => {
                const n = c.counts[i];
                const lo = c.channel.lower[i];
                const hi = c.channel.upper[i];
                // A week still open for reporting has a partial count: never a zone, said as such.
                if (isOpenWeekAt(c, i))
                  return [t('cases.week', { week: wk }), n === null ? f.number(n) : t('cases.partialValue', { cases: f.number(n) }), f.number(lo, 1), f.number(c.channel.centre[i], 1), f.number(hi, 1), n === null ? '' : t('cases.reportingOpen')];
                const zone = n === null || lo === null || hi === null ? null : n > hi ? 'above' : n < lo ? 'below' : 'within';
                return [t('cases.week', { week: wk }), f.number(n), f.number(lo, 1), f.number(c.channel.centre[i], 1), f.number(hi, 1), zone ? w.zone(zone) : ''];
              })}
              emptyText={t('table.empty')}
            />
          </div>
        ))}
      </section>

      {data.vectorClock.length ? (
        <section className="card mt-4 print-section" aria-labelledby="print-heat">
          <h2 id="print-heat" className="section-title">
            {t('print.heatTitle')}
          </h2>
          {data.vectorClock.map((vc) => (
            <div key={vc.profileId} className="mt-3 print-block">
              <h3 className="font-bold">{t('degreeDays.title', { profile: profileLabel({ t }, vc) })}</h3>
              <PrintDegreeDaysChart vc={vc} />
            </div>
          ))}
        </section>
      ) : null}

      <section className="card mt-4 print-section" aria-labelledby="print-tiers">
        <h2 id="print-tiers" className="section-title">
          {t('sections.tiers')}
        </h2>
        <SeriesTable
          caption={t('tierHistory.tableCaption')}
          header={[t('table.week'), t('ladder:table.columns.tier'), t('tierHistory.rangeColumn'), t('ladder:table.columns.score'), ...DRIVERS.map((d) => w.driver(d))]}
          rows={tiers.map((x) => [
            t('common:epiWeek', { week: x.epiWeek, year: x.epiYear }),
            w.tier(x.tier) + (w.confidence(x.confidence) ? ` (${w.confidence(x.confidence)})` : ''),
            w.range(x) ?? '',
            f.number(x.score, 2, true),
            ...DRIVERS.map((d) => f.number(contribution(x, d), 2, true)),
          ])}
          emptyText={t('tierHistory.empty')}
        />
      </section>

      <CautionsPanel className="mt-4 print-cautions" />
      <p className="mt-3 text-xs text-ink-muted">{t('print.footer')}</p>
    </article>
  );
}
