import { useMemo } from 'react';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { DistrictDto } from '../../../shared/api/districts.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../components/data-table';
import { formatLatestPopulation } from '../districts/district-format';

const column = createColumnHelper<PlainTableFeatures, DistrictDto>();
const columns = column.columns([
  column.accessor('code', { header: 'Code', cell: (c) => <span className="font-mono text-sm">{c.getValue()}</span> }),
  column.accessor('name', { header: 'District' }),
  column.accessor((d) => formatLatestPopulation(d), {
    id: 'population',
    header: 'Latest population',
    cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
  }),
]);

export function LadderDistrictsTable({ districts }: { districts: DistrictDto[] }) {
  const data = useMemo(() => [...districts].sort((a, b) => a.code.localeCompare(b.code)), [districts]);
  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (d) => d.id });
  return (
    <DataTable
      table={table}
      caption="Districts you can see"
      emptyText="No districts are assigned to you yet. Ask an admin to add yours."
    />
  );
}
