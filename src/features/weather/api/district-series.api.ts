import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtSeriesResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** GET /api/weather/districts/:id/series — the district's daily series and where it comes from. */
export const districtSeriesQueryOptions = (id: string) =>
  queryOptions({
    queryKey: weatherKeys.series(id),
    queryFn: ({ signal }) => api.get(`/api/weather/districts/${encodeURIComponent(id)}/series`, districtSeriesResponse, signal),
  });
export const useDistrictSeries = (id: string | null) => useQuery({ ...districtSeriesQueryOptions(id ?? ''), enabled: !!id });
