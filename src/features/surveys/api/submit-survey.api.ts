import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SurveyBody } from '../../../../shared/api/surveys.schema';
import { surveyOutbox } from '../offline-queue';

/**
 * Submit a survey the offline-first way: keep it in the outbox, then try to send the outbox. The
 * mutation succeeds once the survey is kept, whether or not the network was there.
 */
export function useSubmitSurvey() {
  const queryClient = useQueryClient();
  return useMutation({
    // The outbox handles being offline; TanStack Query's default would pause the mutation until online.
    networkMode: 'always',
    mutationFn: async (survey: SurveyBody) => {
      const outbox = surveyOutbox();
      outbox.add(survey);
      const result = await outbox.flush();
      return { sent: result.sent.some((s) => s.id === survey.id), result };
    },
    onSuccess: ({ result }) => {
      if (result.sent.length) void queryClient.invalidateQueries({ queryKey: ['surveys'] });
    },
  });
}
