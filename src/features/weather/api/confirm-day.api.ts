import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type ConfirmBody, confirmResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** POST /api/weather/observations/confirm — a held station-day is true: it then counts in the series and the tier. */
export function useConfirmDay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ConfirmBody) => api.post('/api/weather/observations/confirm', body, confirmResponse),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: weatherKeys.all }),
  });
}
