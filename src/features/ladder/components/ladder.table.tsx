import { useId, useMemo, useRef, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import {
  columnFilteringFeature,
  columnVisibilityFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
  type FilterFn,
  type Header,
  type Row,
  type SortFn,
} from '@tanstack/react-table';
import type { LadderRow } from '../../../../shared/api/board.schema';
import { tierRank } from '../../../../shared/tier';
import { i18n } from '../../../i18n';
import { downloadCsv, toCsv, type CsvCell } from '../../../lib/csv';
import { HelpButton, type HelpTopic } from '../../help/help-button';
import { currentLadderWords, tierChangeArrow, useLadderWords, type LadderWords } from '../ladder-format';
import { useRowWindow } from '../use-row-window';
import { TierBadge } from './tier-badge';

/** What each Ladder column also knows: its plain name (column chooser) and its CSV value. */
type LadderColumnMeta = { label: string; csv: (row: LadderRow) => CsvCell; help?: HelpTopic };

/** Tier first, then score within the tier: the order the server ranks by. */
const byTierThenScore: SortFn<any, LadderRow> = (a, b) =>
  tierRank(a.original.tier) - tierRank(b.original.tier) || a.original.score - b.original.score;

/** One text filter over the words a person sees in a row: name, code, tier, drivers, zone. */
const matchesRowText: FilterFn<any, LadderRow> = (row, _columnId, value: string) =>
  searchText(row.original, filterWords()).includes(String(value).trim().toLowerCase());
matchesRowText.autoRemove = (value) => !value || !String(value).trim();

export const ladderFeatures = tableFeatures({
  columnVisibilityFeature,
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, byTierThenScore },
  filterFns: { matchesRowText },
  columnMeta: {} as LadderColumnMeta,
});
type LadderFeatures = typeof ladderFeatures;

/** The words the filter reads, made once per interface language. */
let cachedWords: { language: string; words: LadderWords } | null = null;
function filterWords(): LadderWords {
  if (cachedWords?.language !== i18n.language) cachedWords = { language: i18n.language, words: currentLadderWords() };
  return cachedWords.words;
}

export function searchText(r: LadderRow, words: LadderWords = currentLadderWords()): string {
  return [r.name, r.code, words.tier(r.tier), r.leadingDriver ? words.driver(r.leadingDriver) : '', words.zone(r.channelZone), words.confidence(r.confidence) ?? '']
    .join(' ')
    .toLowerCase();
}

const column = createColumnHelper<LadderFeatures, LadderRow>();

/**
 * The columns, in the interface language (headers, cell words, CSV values). `markDemo`: rows of demo districts carry a small mark, but only where the region
 * mixes demo and real districts; in the all-demo region the page's banner already says it, and the mark
 * would only make every row taller on a phone.
 */
function ladderColumns(w: LadderWords, markDemo: boolean) {
  const { t } = w;
  return column.columns([
    column.accessor('rank', {
      header: t('table.columns.rank'),
      sortUndefined: 'last',
      enableHiding: false,
      meta: { label: t('table.columns.rank'), csv: (r) => r.rank },
      cell: (c) => <span className="tabular-nums">{w.count(c.getValue())}</span>,
    }),
    column.accessor('name', {
      id: 'district',
      header: t('table.columns.district'),
      sortFn: 'alphanumeric',
      enableHiding: false,
      meta: { label: t('table.columns.district'), csv: (r) => r.name },
      cell: (c) => (
        <span className="cell-stack">
          <Link to={`/districts/${c.row.original.districtId}`} className="link truncate">
            {c.getValue()}
          </Link>
          <span className="font-mono text-xs text-ink-muted">
            {c.row.original.code}
            {markDemo && c.row.original.isDemo ? (
              <span className="demo-mark font-sans" title={t('table.demoMarkLabel')}>
                <span aria-hidden="true">{t('table.demoMark')}</span>
                <span className="sr-only">{t('table.demoMarkLabel')}</span>
              </span>
            ) : null}
          </span>
        </span>
      ),
    }),
    column.accessor((r) => r.region?.name ?? '', {
      id: 'region',
      header: t('region.columns.region'),
      sortFn: 'alphanumeric',
      meta: { label: t('region.columns.region'), csv: (r) => r.region?.name ?? '' },
      cell: (c) => <span className="text-sm">{c.row.original.region?.name ?? '—'}</span>,
    }),
    column.accessor('tier', {
      header: t('table.columns.tier'),
      sortFn: 'byTierThenScore',
      sortDescFirst: true,
      meta: { label: t('table.columns.tier'), csv: (r) => w.tier(r.tier), help: 'tier' },
      cell: (c) => {
        const r = c.row.original;
        const range = w.range(r);
        return (
          <span className="cell-stack">
            <TierBadge tier={r.tier} confidence={r.confidence} />
            <span className="text-xs text-ink-muted">
              {t('table.scoreLine', { score: w.score(r.score) })}
              {range ? ` · ${t('table.rangeLine', { range })}` : ''}
            </span>
          </span>
        );
      },
    }),
    // null reads as undefined so that `sortUndefined: 'last'` keeps rows without a value at the end.
    column.accessor((r) => r.tierChange ?? undefined, {
      id: 'change',
      header: t('table.columns.change'),
      sortUndefined: 'last',
      sortDescFirst: true,
      meta: { label: t('table.columns.change'), csv: (r) => w.change(r.tierChange), help: 'change' },
      cell: (c) => {
        const r = c.row.original;
        return (
          <span className="cell-stack">
            <span>
              <span aria-hidden="true" className="change-arrow">
                {tierChangeArrow(r.tierChange)}
              </span>{' '}
              {w.change(r.tierChange)}
            </span>
            {r.scoreChange !== null ? (
              <span className="text-xs text-ink-muted tabular-nums">
                {t('table.scoreChange', { sign: r.scoreChange >= 0 ? '+' : '−', value: w.score(Math.abs(r.scoreChange)) })}
              </span>
            ) : null}
          </span>
        );
      },
    }),
    column.accessor((r) => w.driver(r.leadingDriver), {
      id: 'leadingDriver',
      header: t('table.columns.leadingDriver'),
      sortFn: 'alphanumeric',
      meta: { label: t('table.columns.leadingDriver'), csv: (r) => (r.leadingDriver ? w.driver(r.leadingDriver) : ''), help: 'leadingDriver' },
    }),
    column.accessor((r) => r.casesThisWeek ?? undefined, {
      id: 'cases',
      header: t('table.columns.cases'),
      sortUndefined: 'last',
      sortDescFirst: true,
      meta: { label: t('table.columns.cases'), csv: (r) => r.casesThisWeek, help: 'casesThisWeek' },
      // The count of the newest complete week (never the still-open week of the tier), naming that week and its diseases.
      cell: (c) => {
        const r = c.row.original;
        return (
          <span className="tabular-nums">
            {w.count(r.casesThisWeek)}
            {r.casesThisWeek !== null && r.casesWeek ? (
              // Several diseases are counted, named in full on hover and for screen readers: their long
              // names (e.g. two malaria species) would make every row three lines tall.
              r.casesDiseases.length > 1 ? (
                <span className="block text-xs text-ink-muted" title={r.casesDiseases.map((d) => d.name).join(', ')}>
                  {t('table.casesWeekMany', { week: r.casesWeek.week, count: r.casesDiseases.length })}
                  <span className="sr-only">: {r.casesDiseases.map((d) => d.name).join(', ')}</span>
                </span>
              ) : (
                <span className="block text-xs text-ink-muted">
                  {t('table.casesWeek', { week: r.casesWeek.week, diseases: r.casesDiseases.map((d) => d.name).join(', ') })}
                </span>
              )
            ) : null}
          </span>
        );
      },
    }),
    column.accessor((r) => w.zone(r.channelZone), {
      id: 'channelZone',
      header: t('table.columns.channel'),
      sortFn: 'alphanumeric',
      meta: { label: t('table.columns.channel'), csv: (r) => (r.channelZone ? w.zone(r.channelZone) : ''), help: 'channelZone' },
    }),
    column.accessor((r) => r.latestWeather ?? '', {
      id: 'latestWeather',
      header: t('table.columns.latestWeather'),
      sortFn: 'alphanumeric',
      sortDescFirst: true,
      meta: { label: t('table.columns.latestWeather'), csv: (r) => r.latestWeather ?? '', help: 'latestWeather' },
      cell: (c) => <span className="whitespace-nowrap">{w.day(c.row.original.latestWeather)}</span>,
    }),
  ]);
}

/** The CSV of what the table shows: the filtered, sorted rows and the visible columns. */
export function ladderCsv(
  rows: readonly Row<LadderFeatures, LadderRow>[],
  visible: readonly { id: string; columnDef: { meta?: LadderColumnMeta } }[],
  words: LadderWords = currentLadderWords(),
): string {
  const { t } = words;
  const cols = visible.filter((c) => c.columnDef.meta);
  const header = cols.flatMap((c) =>
    c.id === 'district'
      ? [t('ladder:table.columns.district'), t('ladder:table.columns.code')]
      : c.id === 'tier'
        ? [t('ladder:table.columns.tier'), t('ladder:table.columns.score'), t('ladder:table.columns.tierRange'), t('ladder:table.columns.confidence')]
        : [c.columnDef.meta!.label],
  );
  const body = rows.map((row) => {
    const r = row.original;
    return cols.flatMap((c) => {
      const meta = c.columnDef.meta!;
      if (c.id === 'district') return [r.name, r.code];
      if (c.id === 'tier') return [meta.csv(r), r.score, words.range(r) ?? '', words.confidence(r.confidence) ?? t('ladder:confidence.ok')];
      return [meta.csv(r)];
    });
  });
  return toCsv(header, body);
}

/** Fixed row height (px) of the windowed body; .ladder-table rows use the same height in styles.css. */
export const LADDER_ROW_HEIGHT = 60;

function SortHeader({ header }: { header: Header<LadderFeatures, LadderRow, unknown> }) {
  const sorted = header.column.getIsSorted();
  const meta = header.column.columnDef.meta;
  const label = meta?.label ?? header.column.id;
  return (
    <span className="th-with-help">
      <button type="button" className="sort-button" onClick={header.column.getToggleSortingHandler()}>
        {label}
        <span aria-hidden="true" className="sort-mark">
          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
        </span>
      </button>
      {meta?.help ? <HelpButton topic={meta.help} /> : null}
    </span>
  );
}

const ariaSort = (s: false | 'asc' | 'desc') => (s === 'asc' ? 'ascending' : s === 'desc' ? 'descending' : 'none');

/** Below this width (40rem, a phone) only rank, district, tier and the change since last week show at first. */
const PHONE_QUERY = '(max-width: 40rem)';
const PHONE_HIDDEN_COLUMNS = { leadingDriver: false, cases: false, channelZone: false, latestWeather: false };
const isNarrowScreen = () => typeof window !== 'undefined' && window.matchMedia?.(PHONE_QUERY).matches === true;

/**
 * The Ladder as a table: sortable by every column, one text filter, a column chooser, CSV of what is shown,
 * and a windowed body so thousands of districts scroll smoothly.
 */
export function LadderTable({
  rows,
  caption,
  toolbarExtra,
  toolbarStart,
  showRegion = false,
}: {
  rows: LadderRow[];
  caption: ReactNode;
  toolbarExtra?: ReactNode;
  /** Controls before the text filter (the Ladder's region filter). */
  toolbarStart?: ReactNode;
  /** Whether the region column shows at first (districts belong to regions); on a phone it is one tap away. */
  showRegion?: boolean;
}) {
  const id = useId();
  const words = useLadderWords();
  const { t } = words;
  const markDemo = useMemo(() => rows.some((r) => r.isDemo) && rows.some((r) => !r.isDemo), [rows]);
  const columns = useMemo(() => ladderColumns(words, markDemo), [words, markDemo]);
  // The table caches each row's accessor values until its data changes; the accessors word the values
  // (driver, zone), so a new language must come with a new data array or cells stay in the old language.
  const data = useMemo(() => rows.slice(), [rows, words]);
  const [globalFilter, setGlobalFilter] = useState('');
  const table = useTable({
    features: ladderFeatures,
    columns,
    data,
    getRowId: (r) => r.districtId,
    globalFilterFn: 'matchesRowText',
    getColumnCanGlobalFilter: (c) => c.id === 'district',
    state: { globalFilter },
    // On a phone the Ladder opens with the columns that fit its width; the others are one tap away in "Columns".
    initialState: { columnVisibility: isNarrowScreen() ? { ...PHONE_HIDDEN_COLUMNS, region: false } : { region: showRegion } },
    onGlobalFilterChange: setGlobalFilter,
    enableSortingRemoval: true,
  });
  const visibleRows = table.getRowModel().rows;
  const leafColumns = table.getVisibleLeafColumns();
  const scrollRef = useRef<HTMLDivElement>(null);
  const win = useRowWindow({ count: visibleRows.length, rowHeight: LADDER_ROW_HEIGHT, scrollRef });
  const slice = visibleRows.slice(win.first, win.last);
  const hideable = table.getAllLeafColumns().filter((c) => c.getCanHide());

  const exportCsv = () => {
    const stamp = new Date().toISOString().slice(0, 10);
    downloadCsv(`broodcast-ladder-${stamp}.csv`, ladderCsv(visibleRows, leafColumns, words));
  };

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        {toolbarStart}
        <div className="field min-w-[14rem] flex-1">
          <label htmlFor={`${id}-filter`} className="field-label">
            {t('table.filterLabel')}
          </label>
          <input
            id={`${id}-filter`}
            type="search"
            className="input"
            placeholder={t('table.filterPlaceholder')}
            value={globalFilter}
            onChange={(e) => table.setGlobalFilter(e.currentTarget.value)}
            aria-describedby={`${id}-count`}
          />
        </div>
        <details className="column-chooser">
          <summary className="btn btn-secondary">{t('table.columnsButton')}</summary>
          <fieldset className="column-chooser-panel">
            <legend className="field-label">{t('table.showColumns')}</legend>
            {hideable.map((c) => (
              <label key={c.id} className="flex cursor-pointer items-center gap-2 py-0.5">
                <input type="checkbox" className="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} />
                <span>{c.columnDef.meta?.label ?? c.id}</span>
              </label>
            ))}
          </fieldset>
        </details>
        <button type="button" className="btn btn-secondary" onClick={exportCsv} disabled={visibleRows.length === 0}>
          {t('table.exportCsv')}
        </button>
        {toolbarExtra}
      </div>
      <p id={`${id}-count`} className="text-sm text-ink-muted" aria-live="polite">
        {visibleRows.length === rows.length
          ? t('table.count', { count: rows.length, total: words.count(rows.length) })
          : t('table.matching', { count: rows.length, shown: words.count(visibleRows.length), total: words.count(rows.length) })}
      </p>
      <div ref={scrollRef} className="table-wrap ladder-scroll" onScroll={win.onScroll} tabIndex={0} aria-labelledby={`${id}-caption`}>
        <table className="data-table ladder-table" aria-rowcount={visibleRows.length + 1}>
          <caption id={`${id}-caption`} className="sr-only">
            {caption}
          </caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} aria-rowindex={1}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" aria-sort={ariaSort(header.column.getIsSorted())}>
                    {header.isPlaceholder ? null : <SortHeader header={header} />}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {visibleRows.length === 0 ? (
              <tr>
                <td colSpan={leafColumns.length} className="text-ink-muted">
                  {rows.length === 0 ? t('table.emptyNoTiers') : t('table.emptyNoMatch')}
                </td>
              </tr>
            ) : (
              <>
                {win.padTop > 0 ? <tr aria-hidden="true" className="spacer-row" style={{ height: win.padTop }} /> : null}
                {slice.map((row, i) => (
                  <tr key={row.id} aria-rowindex={win.first + i + 2} data-district={row.original.code}>
                    {row.getVisibleCells().map((cell) =>
                      cell.column.id === 'district' ? (
                        <th key={cell.id} scope="row">
                          <table.FlexRender cell={cell} />
                        </th>
                      ) : (
                        <td key={cell.id}>
                          <table.FlexRender cell={cell} />
                        </td>
                      ),
                    )}
                  </tr>
                ))}
                {win.padBottom > 0 ? <tr aria-hidden="true" className="spacer-row" style={{ height: win.padBottom }} /> : null}
              </>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
