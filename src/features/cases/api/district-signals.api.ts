import { queryOptions, useQuery } from '@tanstack/react-query';
import { signalsResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** GET /api/districts/:id/cases — one season of a district and disease with its channel and signals. */
export const districtSignalsQueryOptions = (districtId: string, diseaseId: string, year?: number) =>
  queryOptions({
    queryKey: casesKeys.signals(districtId, diseaseId, year),
    queryFn: ({ signal }) =>
      api.get(
        `/api/districts/${encodeURIComponent(districtId)}/cases?diseaseId=${encodeURIComponent(diseaseId)}${year ? `&year=${year}` : ''}`,
        signalsResponse,
        signal,
      ),
  });
export const useDistrictSignals = (districtId: string, diseaseId: string | undefined, year?: number) =>
  useQuery({ ...districtSignalsQueryOptions(districtId, diseaseId ?? '', year), enabled: !!diseaseId });
