import { useMutation, useQueryClient } from '@tanstack/react-query';
import { districtDto, type PopulationBody } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { afterDistrictChange } from './district-cache';

export type SetPopulationVariables = { id: string; population: PopulationBody };

/** PUT /api/districts/:id/populations (admin) — the population of one year. */
export const setPopulation = ({ id, population }: SetPopulationVariables) =>
  api.put(`/api/districts/${encodeURIComponent(id)}/populations`, population, districtDto);

export function useSetPopulation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setPopulation,
    onSuccess: (district) => afterDistrictChange(queryClient, district),
  });
}
