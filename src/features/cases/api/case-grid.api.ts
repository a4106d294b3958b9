import { queryOptions, useQuery } from '@tanstack/react-query';
import { gridResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** GET /api/cases/grid — the last twelve weeks of one disease for the districts in view. */
export const caseGridQueryOptions = (diseaseId: string, scope: 'mine' | 'all') =>
  queryOptions({
    queryKey: casesKeys.grid(diseaseId, scope),
    queryFn: ({ signal }) =>
      api.get(`/api/cases/grid?diseaseId=${encodeURIComponent(diseaseId)}&scope=${scope}&weeks=12`, gridResponse, signal),
  });
export const useCaseGrid = (diseaseId: string | undefined, scope: 'mine' | 'all') =>
  useQuery({ ...caseGridQueryOptions(diseaseId ?? '', scope), enabled: !!diseaseId });
