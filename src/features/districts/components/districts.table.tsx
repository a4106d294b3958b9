import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { DistrictDto } from '../../../../shared/api/districts.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { useFormat, type Formatters } from '../../../i18n/format';
import { formatLatestPopulation } from '../district-format';
import { BoundaryUploadForm } from './boundary-upload.form';
import { PopulationForm } from './population.form';
import { RenameDistrictForm } from './rename-district.form';

const column = createColumnHelper<PlainTableFeatures, DistrictDto>();

const baseColumns = (t: TFunction, f: Formatters) => [
  column.accessor('code', { header: t('fields.code'), cell: (c) => <span className="font-mono text-sm">{c.getValue()}</span> }),
  column.accessor('name', {
    header: t('fields.name'),
    cell: (c) => (
      <>
        {c.getValue()}
        {c.row.original.isDemo ? (
          <span className="demo-mark" title={t('table.demoMarkLabel')}>
            <span aria-hidden="true">{t('table.demoMark')}</span>
            <span className="sr-only">{t('table.demoMarkLabel')}</span>
          </span>
        ) : null}
      </>
    ),
  }),
  column.accessor((d) => formatLatestPopulation(d, t, f), {
    id: 'population',
    header: t('table.latestPopulation'),
    cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
  }),
  column.accessor((d) => (d.hasBoundary ? t('table.hasBoundary') : t('table.noBoundary')), { id: 'boundary', header: t('table.boundary') }),
];

function DistrictEditor({ district, onClose }: { district: DistrictDto; onClose: () => void }) {
  const { t } = useTranslation('districts');
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => headingRef.current?.focus(), []);
  return (
    <section aria-labelledby={`editor-${district.id}`} className="space-y-4 pt-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`editor-${district.id}`} ref={headingRef} tabIndex={-1} className="font-bold">
          {t('table.editTitle', { code: district.code, name: district.name })}
        </h3>
        <button type="button" className="btn btn-secondary btn-small" onClick={onClose}>
          {t('table.close')}
        </button>
      </div>
      <div className="grid gap-6 md:grid-cols-3">
        <RenameDistrictForm district={district} />
        <PopulationForm district={district} />
        <BoundaryUploadForm district={district} />
      </div>
    </section>
  );
}

/** Districts per page of the list. */
export const DISTRICTS_PAGE = 50;

export function DistrictsTable({ districts }: { districts: DistrictDto[] }) {
  const { t } = useTranslation('districts');
  const f = useFormat();
  const id = useId();
  const [editingId, setEditingId] = useState<string | null>(null);
  const [query, setQuery] = useState('');
  const [page, setPage] = useState(0);
  const sorted = useMemo(() => [...districts].sort((a, b) => a.code.localeCompare(b.code)), [districts]);
  // A country has thousands of districts (issue 17): the list is searched and shown a page at a time.
  const matching = useMemo(() => {
    const words = query.toLowerCase().split(/\s+/).filter(Boolean);
    return words.length ? sorted.filter((d) => words.every((w) => `${d.code} ${d.name}`.toLowerCase().includes(w))) : sorted;
  }, [sorted, query]);
  const pages = Math.max(1, Math.ceil(matching.length / DISTRICTS_PAGE));
  const current = Math.min(page, pages - 1);
  const data = useMemo(() => matching.slice(current * DISTRICTS_PAGE, (current + 1) * DISTRICTS_PAGE), [matching, current]);

  const columns = useMemo(
    () =>
      column.columns([
        ...baseColumns(t, f),
        column.display({
          id: 'actions',
          header: t('table.actions'),
          cell: ({ row }) => (
            <button
              type="button"
              className="btn btn-secondary btn-small"
              aria-expanded={editingId === row.original.id}
              aria-label={t('table.editLabel', { code: row.original.code, name: row.original.name })}
              onClick={() => setEditingId(editingId === row.original.id ? null : row.original.id)}
            >
              {t('table.edit')}
            </button>
          ),
        }),
      ]),
    [t, f, editingId],
  );

  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (d) => d.id });

  const searchable = districts.length > DISTRICTS_PAGE;
  return (
    <div className="space-y-3">
      {searchable ? (
        <div className="flex flex-wrap items-end gap-3">
          <div className="field min-w-[14rem] flex-1">
            <label htmlFor={`${id}-search`} className="field-label">
              {t('table.search')}
            </label>
            <input
              id={`${id}-search`}
              type="search"
              className="input"
              autoComplete="off"
              value={query}
              onChange={(e) => {
                setQuery(e.currentTarget.value);
                setPage(0);
              }}
              aria-describedby={`${id}-page`}
            />
          </div>
          <div className="flex gap-2 pb-1">
            <button type="button" className="btn btn-secondary btn-small" disabled={current === 0} onClick={() => setPage(current - 1)}>
              {t('table.previous')}
            </button>
            <button type="button" className="btn btn-secondary btn-small" disabled={current >= pages - 1} onClick={() => setPage(current + 1)}>
              {t('table.next')}
            </button>
          </div>
          <p id={`${id}-page`} className="w-full text-sm text-ink-muted" aria-live="polite">
            {matching.length === 0
              ? t('table.noMatch')
              : t('table.page', { from: f.number(current * DISTRICTS_PAGE + 1), to: f.number(current * DISTRICTS_PAGE + data.length), total: f.number(matching.length) })}
          </p>
        </div>
      ) : null}
    <DataTable
      table={table}
      caption={t('table.caption')}
      emptyText={searchable ? t('table.noMatch') : t('table.empty')}
      renderBelowRow={(row) =>
        editingId === row.original.id ? (
          <DistrictEditor key={row.original.id} district={row.original} onClose={() => setEditingId(null)} />
        ) : null
      }
    />
    </div>
  );
}
