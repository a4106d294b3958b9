import { queryOptions, useQuery } from '@tanstack/react-query';
import { stationsResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** GET /api/weather/stations — every station the role may see (a community worker: those feeding their district). */
export const stationsQueryOptions = () =>
  queryOptions({
    queryKey: weatherKeys.stations,
    queryFn: ({ signal }) => api.get('/api/weather/stations', stationsResponse, signal),
    select: (r) => r.stations,
  });
export const useStations = () => useQuery(stationsQueryOptions());
