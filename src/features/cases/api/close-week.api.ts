import { useMutation, useQueryClient } from '@tanstack/react-query';
import { closureResponse, type CloseWeekBody } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** POST /api/districts/:id/weeks/close (epidemiologist of the district, supervisor) — lock a week's counts. */
export const closeWeek = ({ districtId, week }: { districtId: string; week: CloseWeekBody }) =>
  api.post(`/api/districts/${encodeURIComponent(districtId)}/weeks/close`, week, closureResponse);

export function useCloseWeek() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: closeWeek, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
