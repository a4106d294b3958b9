import { useMutation, useQueryClient } from '@tanstack/react-query';
import { districtDto } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { afterDistrictChange } from './district-cache';

/** `confirm` saves a boundary the server's plausibility check questioned (far away, or coordinates that look swapped). */
export type UploadBoundaryVariables = { id: string; geojson: unknown; confirm?: boolean };

/** PUT /api/districts/:id/boundary (admin) — the GeoJSON of the boundary, as read from the admin's file. */
export const uploadBoundary = ({ id, geojson, confirm }: UploadBoundaryVariables) =>
  api.put(`/api/districts/${encodeURIComponent(id)}/boundary${confirm ? '?confirm=true' : ''}`, geojson, districtDto);

export function useUploadBoundary() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadBoundary,
    onSuccess: (district) => afterDistrictChange(queryClient, district),
  });
}
