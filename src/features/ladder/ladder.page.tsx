import { Link } from 'react-router-dom';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { canUse, useSession } from '../../app/session';
import { CautionsPanel } from '../cautions/cautions-panel';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { RegionMap } from '../region-map/region-map';
import { useBoard } from './api/board.api';
import { LadderTable } from './components/ladder.table';
import { epiWeekText, formatDateTime, formatDay } from './ladder-format';
import './ladder.css';

const EMPTY: never[] = [];

/** The home screen: districts ranked by this week's tier, beside the region map, with the cautions in view. */
export function LadderPage() {
  const board = useBoard();
  const me = useSession();
  const rows = board.data?.rows ?? EMPTY;
  const week = board.data ? epiWeekText(board.data.epiYear, board.data.epiWeek) : null;
  const lead = board.data?.asOf
    ? `Districts ranked by tier, then score, for ${week ?? 'the latest week'} (data up to ${formatDay(board.data.asOf)}; computed ${formatDateTime(board.data.computedAt)}).`
    : 'Districts ranked by this week’s tier, then score.';

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={lead}>Ladder</PageHeading>
      <DemoDataLabel districts={rows} />
      <CautionsPanel className="mb-6" />
      {board.isPending ? (
        <p className="text-ink-muted">Loading the Ladder…</p>
      ) : board.isError ? (
        <FormMessage kind="error">{board.error.message}</FormMessage>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
          <div className="min-w-0">
            {rows.length === 0 && canUse(me.role, ['admin', 'officer']) ? (
              <FormMessage kind="info">
                No tiers yet. <Link to="/season-runs" className="link">Run the season</Link> to compute them.
              </FormMessage>
            ) : null}
            <LadderTable rows={rows} caption={`The Ladder${week ? `, ${week}` : ''}: districts ranked by tier and score`} />
          </div>
          <RegionMap rows={rows} />
        </div>
      )}
    </section>
  );
}
