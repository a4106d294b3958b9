import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { caseCountDto } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** POST /api/cases/counts/:id/void (epidemiologist, assigned districts) — void a count entered in error, with a reason. */
export const voidCount = ({ countId, reason }: { countId: string; reason: string }) =>
  api.post(`/api/cases/counts/${encodeURIComponent(countId)}/void`, { reason }, z.object({ count: caseCountDto }));

export function useVoidCount() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: voidCount, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
