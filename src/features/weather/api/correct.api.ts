import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type CorrectionBody, type VoidDayBody, uploadDto } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** PUT /api/weather/observations — one corrected day, through the same checks as an upload. */
export function useCorrectDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CorrectionBody) => api.put('/api/weather/observations', body, uploadDto),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.all }),
  });
}

/** POST /api/weather/observations/void — void one station-day entered in error, with a reason (admin, officer). */
export function useVoidDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: VoidDayBody) => api.post('/api/weather/observations/void', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.all }),
  });
}

/** POST /api/weather/feed/pull — pull the configured station-data feed now. */
export function usePullFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/weather/feed/pull', {}, uploadDto),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.all }),
  });
}
