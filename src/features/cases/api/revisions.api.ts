import { queryOptions, useQuery } from '@tanstack/react-query';
import { revisionsResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** GET /api/cases/counts/:id/revisions — who changed a count, when, from what to what, and why. */
export const revisionsQueryOptions = (countId: string) =>
  queryOptions({
    queryKey: casesKeys.revisions(countId),
    queryFn: ({ signal }) => api.get(`/api/cases/counts/${encodeURIComponent(countId)}/revisions`, revisionsResponse, signal),
  });
export const useRevisions = (countId: string) => useQuery(revisionsQueryOptions(countId));
