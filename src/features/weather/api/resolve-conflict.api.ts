import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type ResolveConflictBody, resolveConflictResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** POST /api/weather/conflicts/:id/resolve — keep the hand correction or take the incoming value, with a reason. */
export function useResolveConflict() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: ResolveConflictBody & { id: string }) =>
      api.post(`/api/weather/conflicts/${encodeURIComponent(id)}/resolve`, body, resolveConflictResponse),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.all }),
  });
}
