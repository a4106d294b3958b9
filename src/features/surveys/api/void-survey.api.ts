import { useMutation, useQueryClient } from '@tanstack/react-query';
import { surveyDto } from '../../../../shared/api/surveys.schema';
import { api } from '../../../lib/api-client';

/** POST /api/surveys/:id/void (officer, community worker; their districts) — void a survey entered in error, with a reason. */
export const voidSurvey = ({ surveyId, reason }: { surveyId: string; reason: string }) =>
  api.post(`/api/surveys/${encodeURIComponent(surveyId)}/void`, { reason }, surveyDto);

export function useVoidSurvey() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: voidSurvey, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['surveys'] }) });
}
