import { Link } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { canUse, useSession } from '../../app/session';
import { CautionsPanel } from '../cautions/cautions-panel';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { FirstRunTour, TourButton, useFirstRunTour } from '../help/first-run-tour';
import { RegionMap } from '../region-map/region-map';
import { useBoard } from './api/board.api';
import { LadderTable } from './components/ladder.table';
import { useLadderWords } from './ladder-format';
import { WorkerHome } from './worker-home';
import './ladder.css';
import { errorText } from '../../lib/error-text';

const EMPTY: never[] = [];

/** The home screen: districts ranked by this week's tier, beside the region map, with the cautions in view. */
export function LadderPage() {
  const { t } = useTranslation('ladder');
  const words = useLadderWords();
  const board = useBoard();
  const me = useSession();
  const tour = useFirstRunTour(me.id, !board.isPending);
  const rows = board.data?.rows ?? EMPTY;
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
          <CautionsPanel className="mb-6" />
        </div>
      )}
      {board.isPending ? (
        <p className="text-ink-muted">{t('loading')}</p>
      ) : board.isError ? (
        <FormMessage kind="error">{errorText(board.error)}</FormMessage>
      ) : (
        <div className="grid gap-6">
          <div className="min-w-0" data-tour="ladder-table">
            {rows.length === 0 && canUse(me.role, ['admin', 'officer']) ? (
              <FormMessage kind="info">
                <Trans t={t} i18nKey="noTiersYet" components={{ run: <Link to="/season-runs" className="link" /> }} />
              </FormMessage>
            ) : null}
            <LadderTable rows={rows} caption={week ? t('captionWeek', { week }) : t('caption')} />
          </div>
          <div className="min-w-0" data-tour="region-map">
            <RegionMap rows={rows} />
          </div>
        </div>
      )}
      <FirstRunTour role={me.role} open={tour.open} onClose={tour.close} />
    </section>
  );
}
