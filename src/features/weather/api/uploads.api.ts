import { queryOptions, useQuery } from '@tanstack/react-query';
import { uploadDto, uploadsResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** GET /api/weather/uploads — the latest intakes. */
export const uploadsQueryOptions = () =>
  queryOptions({
    queryKey: weatherKeys.uploads,
    queryFn: ({ signal }) => api.get('/api/weather/uploads', uploadsResponse, signal),
    select: (r) => r.uploads,
  });
export const useUploads = () => useQuery(uploadsQueryOptions());

/** GET /api/weather/uploads/:id — polled every half second while the server checks the file. */
export const uploadQueryOptions = (id: string) =>
  queryOptions({
    queryKey: weatherKeys.upload(id),
    queryFn: ({ signal }) => api.get(`/api/weather/uploads/${encodeURIComponent(id)}`, uploadDto, signal),
    refetchInterval: (q) => (q.state.data?.status === 'processing' ? 500 : false),
  });
export const useUpload = (id: string | null) => useQuery({ ...uploadQueryOptions(id ?? ''), enabled: !!id });
