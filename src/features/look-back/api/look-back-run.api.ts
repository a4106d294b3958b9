import { useEffect, useRef } from 'react';
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { lookBackRunDto } from '../../../../shared/api/look-back.schema';
import { api } from '../../../lib/api-client';
import { lookBackRunsQueryKey } from './look-back-runs.api';

export const lookBackRunQueryKey = (id: string) => [...lookBackRunsQueryKey, id] as const;

/** How often a running Look-back is asked for its progress. */
export const LOOK_BACK_POLL_MS = 1000;

/** GET /api/look-back/runs/:id — one Look-back with its progress and warnings; polled while it runs. */
export const lookBackRunQueryOptions = (id: string) =>
  queryOptions({
    queryKey: lookBackRunQueryKey(id),
    queryFn: ({ signal }) => api.get(`/api/look-back/runs/${encodeURIComponent(id)}`, lookBackRunDto, signal),
    refetchInterval: (query) => (query.state.data?.status === 'running' ? LOOK_BACK_POLL_MS : false),
    staleTime: 0,
  });

/** The Look-back with `id` (none: nothing is fetched); when it stops running, the list is refreshed. */
export function useLookBackRun(id: string | null) {
  const queryClient = useQueryClient();
  const query = useQuery({ ...lookBackRunQueryOptions(id ?? ''), enabled: id !== null });
  const seenRunning = useRef<string | null>(null);
  const run = query.data;
  useEffect(() => {
    if (!run) return;
    if (run.status === 'running') seenRunning.current = run.id;
    else if (seenRunning.current === run.id) {
      seenRunning.current = null;
      void queryClient.invalidateQueries({ queryKey: lookBackRunsQueryKey });
    }
  }, [run, queryClient]);
  return query;
}
