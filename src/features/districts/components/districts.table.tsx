import { useEffect, useMemo, useRef, useState } from 'react';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { DistrictDto } from '../../../../shared/api/districts.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { formatLatestPopulation } from '../district-format';
import { BoundaryUploadForm } from './boundary-upload.form';
import { PopulationForm } from './population.form';
import { RenameDistrictForm } from './rename-district.form';

const column = createColumnHelper<PlainTableFeatures, DistrictDto>();

const baseColumns = [
  column.accessor('code', { header: 'Code', cell: (c) => <span className="font-mono text-sm">{c.getValue()}</span> }),
  column.accessor('name', { header: 'Name' }),
  column.accessor((d) => formatLatestPopulation(d), {
    id: 'population',
    header: 'Latest population',
    cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
  }),
  column.accessor((d) => (d.hasBoundary ? 'Yes' : 'No'), { id: 'boundary', header: 'Boundary' }),
];

function DistrictEditor({ district, onClose }: { district: DistrictDto; onClose: () => void }) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => headingRef.current?.focus(), []);
  return (
    <section aria-labelledby={`editor-${district.id}`} className="space-y-4 pt-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`editor-${district.id}`} ref={headingRef} tabIndex={-1} className="font-bold">
          Edit {district.code} — {district.name}
        </h3>
        <button type="button" className="btn btn-secondary btn-small" onClick={onClose}>
          Close
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
  const [editingId, setEditingId] = useState<string | null>(null);
  const data = useMemo(() => [...districts].sort((a, b) => a.code.localeCompare(b.code)), [districts]);

  const columns = useMemo(
    () =>
      column.columns([
        ...baseColumns,
        column.display({
          id: 'actions',
          header: 'Actions',
          cell: ({ row }) => (
            <button
              type="button"
              className="btn btn-secondary btn-small"
              aria-expanded={editingId === row.original.id}
              aria-label={`Edit ${row.original.code} ${row.original.name}`}
              onClick={() => setEditingId(editingId === row.original.id ? null : row.original.id)}
            >
              Edit
            </button>
          ),
        }),
      ]),
    [editingId],
  );

  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (d) => d.id });

  return (
    <DataTable
      table={table}
      caption="Districts of this deployment"
      emptyText="No districts yet. Create the first one below."
      renderBelowRow={(row) =>
        editingId === row.original.id ? (
          <DistrictEditor key={row.original.id} district={row.original} onClose={() => setEditingId(null)} />
        ) : null
      }
    />
  );
}
