import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { districtFileResponse } from '../../../../shared/api/board.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** `season` null: the season the server takes as current (the newest with data). */
export const districtFileQueryKey = (id: string, season: number | null) =>
  [...queryKeys.districts.detail(id), 'file', season] as const;

/** GET /api/districts/:id/file?season=YYYY — the whole District file in one answer. */
export const districtFileQueryOptions = (id: string, season: number | null) =>
  queryOptions({
    queryKey: districtFileQueryKey(id, season),
    queryFn: ({ signal }) =>
      api.get(
        `/api/districts/${encodeURIComponent(id)}/file${season === null ? '' : `?season=${season}`}`,
        districtFileResponse,
        signal,
      ),
  });

/** The file of one season; while another season loads, the previous one stays on screen. */
export const useDistrictFile = (id: string, season: number | null) =>
  useQuery({ ...districtFileQueryOptions(id, season), placeholderData: keepPreviousData });

/** An earlier season for comparison (nothing is fetched while none is chosen). */
export const useComparedDistrictFile = (id: string, season: number | null) =>
  useQuery({ ...districtFileQueryOptions(id, season), enabled: season !== null });
