import { useEffect, useRef } from 'react';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { seasonRunDto, type SeasonRunDto } from '../../../../shared/api/board.schema';
import { api } from '../../../lib/api-client';
import { seasonRunsQueryKey } from './season-runs.api';
import { afterSeasonRunFinished } from './start-season-run.api';

export const seasonRunQueryKey = (id: string) => [...seasonRunsQueryKey, id] as const;

/** How often a running season run is asked for its progress. */
export const SEASON_RUN_POLL_MS = 1000;

/** GET /api/season-runs/:id — one run; polled while it is running. */
export const seasonRunQueryOptions = (id: string) =>
  queryOptions({
    queryKey: seasonRunQueryKey(id),
    queryFn: ({ signal }) => api.get(`/api/season-runs/${encodeURIComponent(id)}`, seasonRunDto, signal),
    refetchInterval: (query) => (query.state.data?.status === 'running' ? SEASON_RUN_POLL_MS : false),
    staleTime: 0,
  });

/**
 * The run with `id` (none: nothing is fetched). When a run this screen watched stops running, the board, the
 * run list and every district (their files) are refreshed.
 */
export function useSeasonRun(id: string | null) {
  const queryClient = useQueryClient();
  const query = useQuery({ ...seasonRunQueryOptions(id ?? ''), enabled: id !== null });
  const seenRunning = useRef<string | null>(null);
  const run: SeasonRunDto | undefined = query.data;
  useEffect(() => {
    if (!run) return;
    if (run.status === 'running') seenRunning.current = run.id;
    else if (seenRunning.current === run.id) {
      seenRunning.current = null;
      void afterSeasonRunFinished(queryClient);
    }
  }, [run, queryClient]);
  return query;
}
