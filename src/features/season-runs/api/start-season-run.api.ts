import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { seasonRunDto } from '../../../../shared/api/board.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { boardQueryKey } from '../../ladder/api/board.api';
import { seasonRunsQueryKey } from './season-runs.api';

export type StartSeasonRunBody = { full?: boolean };

/** POST /api/season-runs (admin, health officer) — 202 with the run it started; 409 `run_in_progress` when one runs. */
export const startSeasonRun = (body: StartSeasonRunBody) => api.post('/api/season-runs', body, seasonRunDto);

/** A run has finished: the board, the run history and every District file may have changed. */
export async function afterSeasonRunFinished(queryClient: QueryClient) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: seasonRunsQueryKey }),
    queryClient.invalidateQueries({ queryKey: boardQueryKey }),
    queryClient.invalidateQueries({ queryKey: queryKeys.districts.all }),
  ]);
}

export function useStartSeasonRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startSeasonRun,
    onSuccess: async (run) => {
      queryClient.setQueryData([...seasonRunsQueryKey, run.id], run);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: seasonRunsQueryKey }),
        queryClient.invalidateQueries({ queryKey: boardQueryKey }),
      ]);
    },
  });
}
