import { queryOptions, useQuery } from '@tanstack/react-query';
import { lookBackScoresResponse } from '../../../../shared/api/look-back.schema';
import { api } from '../../../lib/api-client';
import { lookBackRunQueryKey } from './look-back-run.api';

export type WarnAt = 'raised' | 'high' | 'critical';

/** GET /api/look-back/runs/:id/scores — overall scores at every lead time 1–12, warning from `warnAt` up. */
export const lookBackScoresQueryOptions = (id: string, warnAt: WarnAt) =>
  queryOptions({
    queryKey: [...lookBackRunQueryKey(id), 'scores', warnAt] as const,
    queryFn: ({ signal }) =>
      api.get(`/api/look-back/runs/${encodeURIComponent(id)}/scores?level=overall&warnAt=${warnAt}`, lookBackScoresResponse, signal),
  });

export const useLookBackScores = (id: string | null, warnAt: WarnAt) =>
  useQuery({ ...lookBackScoresQueryOptions(id ?? '', warnAt), enabled: id !== null });
