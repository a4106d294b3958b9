import { queryOptions, useQuery } from '@tanstack/react-query';
import { fieldRecordsResponse } from '../../../../shared/api/field-records.schema';
import { api } from '../../../lib/api-client';

/** The query of field records: the caller's own newest, or every visible record of a week (7 days from `weekStart`). */
export type FieldRecordsFilter = { mine?: boolean; weekStart?: string };

export const fieldRecordsQueryOptions = (filter: FieldRecordsFilter) => {
  const params = new URLSearchParams();
  if (filter.mine) params.set('mine', 'true');
  if (filter.weekStart) params.set('weekStart', filter.weekStart);
  const qs = params.toString();
  return queryOptions({
    queryKey: ['field-records', filter] as const,
    queryFn: ({ signal }) => api.get(`/api/field-records${qs ? `?${qs}` : ''}`, fieldRecordsResponse, signal),
  });
};

/** GET /api/field-records?mine=&weekStart= */
export const useFieldRecords = (filter: FieldRecordsFilter) => useQuery(fieldRecordsQueryOptions(filter));
