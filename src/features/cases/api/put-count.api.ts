import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseCountResult, type CaseCountBody } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

export type PutCountVariables = { districtId: string; body: CaseCountBody };

/** PUT /api/districts/:id/cases (epidemiologist, assigned districts) — enter or correct one weekly count. */
export const putCount = ({ districtId, body }: PutCountVariables) =>
  api.put(`/api/districts/${encodeURIComponent(districtId)}/cases`, body, caseCountResult);

export function usePutCount() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: putCount, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
