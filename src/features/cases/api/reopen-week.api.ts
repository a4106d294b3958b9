import { useMutation, useQueryClient } from '@tanstack/react-query';
import { reopenResponse, type ReopenWeekBody } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** POST /api/districts/:id/weeks/reopen (epidemiologist of the district, supervisor) — undo a closing, with a reason. */
export const reopenWeek = ({ districtId, week }: { districtId: string; week: ReopenWeekBody }) =>
  api.post(`/api/districts/${encodeURIComponent(districtId)}/weeks/reopen`, week, reopenResponse);

export function useReopenWeek() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: reopenWeek, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
