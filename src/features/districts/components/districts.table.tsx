import { useEffect, useMemo, useRef, useState } from 'react';
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
  column.accessor('name', { header: t('fields.name') }),
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

export function DistrictsTable({ districts }: { districts: DistrictDto[] }) {
  const { t } = useTranslation('districts');
  const f = useFormat();
  const [editingId, setEditingId] = useState<string | null>(null);
  const data = useMemo(() => [...districts].sort((a, b) => a.code.localeCompare(b.code)), [districts]);

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

  return (
    <DataTable
      table={table}
      caption={t('table.caption')}
      emptyText={t('table.empty')}
      renderBelowRow={(row) =>
        editingId === row.original.id ? (
          <DistrictEditor key={row.original.id} district={row.original} onClose={() => setEditingId(null)} />
        ) : null
      }
    />
  );
}
