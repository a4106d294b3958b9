import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { districtDto, type districtUpdateBody } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { afterDistrictChange } from './district-cache';

export type DistrictUpdateBody = z.output<typeof districtUpdateBody>;
export type UpdateDistrictVariables = { id: string; changes: DistrictUpdateBody };

/** PATCH /api/districts/:id (admin) — a new code and/or name. */
export const updateDistrict = ({ id, changes }: UpdateDistrictVariables) =>
  api.patch(`/api/districts/${encodeURIComponent(id)}`, changes, districtDto);

export function useUpdateDistrict() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDistrict,
    onSuccess: (district) => afterDistrictChange(queryClient, district, true),
  });
}
