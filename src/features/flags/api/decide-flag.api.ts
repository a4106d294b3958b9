import { useMutation, useQueryClient } from '@tanstack/react-query';
import { flagDto, type ApproveFlagBody, type RaiseFlagBody, type RejectFlagBody } from '../../../../shared/api/flags.schema';
import { api } from '../../../lib/api-client';
import { advisoriesKey, flagsKeys } from './flags.api';

/** POST /api/flags/:id/approve (supervisor) — 409 `flag_decided` when another supervisor was first. */
export const approveFlag = ({ id, body }: { id: string; body: ApproveFlagBody }) =>
  api.post(`/api/flags/${encodeURIComponent(id)}/approve`, body, flagDto);
/** POST /api/flags/:id/reject (supervisor) — a reason is required. */
export const rejectFlag = ({ id, body }: { id: string; body: RejectFlagBody }) =>
  api.post(`/api/flags/${encodeURIComponent(id)}/reject`, body, flagDto);
/** POST /api/flags (health officer, epidemiologist of the district). */
export const raiseFlag = (body: RaiseFlagBody) => api.post('/api/flags', body, flagDto);

function useFlagMutation<V, R>(fn: (v: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    // A 409 means the flag moved on: refresh either way so the screen shows the decision.
    onSettled: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: flagsKeys.all }),
      queryClient.invalidateQueries({ queryKey: advisoriesKey }),
    ]),
  });
}
export const useApproveFlag = () => useFlagMutation(approveFlag);
export const useRejectFlag = () => useFlagMutation(rejectFlag);
export const useRaiseFlag = () => useFlagMutation(raiseFlag);
