import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtOutlookResponse } from '../../../../shared/api/outlook.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** `disease` null: the district's disease with the most reported cases (the server's choice). */
export const districtOutlookQueryKey = (id: string, disease: string | null) =>
  [...queryKeys.districts.detail(id), 'outlook', disease] as const;

/**
 * GET /api/districts/:id/outlook?disease=… — the Case outlook (docs/outlook.md): forecasts only for the
 * weeks ahead that beat the seasonal null, with the skill of every week ahead. The first answer for a
 * district takes several seconds (the model is fitted and scored on past seasons), later ones come from
 * the server's cache; the answer changes only when a week finishes or the counts or weather change, so it
 * is kept fresh for ten minutes.
 */
export const districtOutlookQueryOptions = (id: string, disease: string | null) =>
  queryOptions({
    queryKey: districtOutlookQueryKey(id, disease),
    queryFn: ({ signal }) =>
      api.get(
        `/api/districts/${encodeURIComponent(id)}/outlook${disease === null ? '' : `?disease=${encodeURIComponent(disease)}`}`,
        districtOutlookResponse,
        signal,
      ),
    staleTime: 10 * 60_000,
  });

/** The outlook, fetched only once `enabled` (the panel has come near the viewport): it never holds up the District file. */
export const useDistrictOutlook = (id: string, disease: string | null, enabled: boolean) =>
  useQuery({ ...districtOutlookQueryOptions(id, disease), enabled });
