import { queryOptions, useQuery } from '@tanstack/react-query';
import { boardResponse } from '../../../../shared/api/board.schema';
import { api } from '../../../lib/api-client';

/** The Ladder's key; a finished season run invalidates it. */
export const boardQueryKey = ['board'] as const;

/** GET /api/board — this week's districts, already ranked by tier then score (a community worker: their own). */
export const boardQueryOptions = () =>
  queryOptions({
    queryKey: boardQueryKey,
    queryFn: ({ signal }) => api.get('/api/board', boardResponse, signal),
  });

export const useBoard = () => useQuery(boardQueryOptions());
