import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { districtDto, type districtCreateBody } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { afterDistrictChange } from './district-cache';

export type DistrictCreateBody = z.output<typeof districtCreateBody>;

/** POST /api/districts (admin) — 201 with the new district. */
export const createDistrict = (body: DistrictCreateBody) => api.post('/api/districts', body, districtDto);

export function useCreateDistrict() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDistrict,
    onSuccess: (district) => afterDistrictChange(queryClient, district),
  });
}
