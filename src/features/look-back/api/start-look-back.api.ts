import { useMutation, useQueryClient } from '@tanstack/react-query';
import { lookBackRunDto, type StartLookBackBody } from '../../../../shared/api/look-back.schema';
import { api } from '../../../lib/api-client';
import { lookBackRunsQueryKey } from './look-back-runs.api';

/** POST /api/look-back/runs (epidemiologist, admin) — 202 with the run; 409 `look_back_in_progress` when one runs. */
export const startLookBack = (body: StartLookBackBody) => api.post('/api/look-back/runs', body, lookBackRunDto);

export function useStartLookBack() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startLookBack,
    onSuccess: async (run) => {
      queryClient.setQueryData([...lookBackRunsQueryKey, run.id], run);
      await queryClient.invalidateQueries({ queryKey: lookBackRunsQueryKey });
    },
  });
}
