import type { QueryClient } from '@tanstack/react-query';
import type { DistrictDto } from '../../../../shared/api/districts.schema';
import { queryKeys } from '../../../lib/query-keys';

/**
 * After any change to a district: store the answer under its own key and refresh the district family.
 * District codes and names also appear inside users and the signed-in user, so those refresh too.
 */
export async function afterDistrictChange(queryClient: QueryClient, district: DistrictDto, renamed = false) {
  queryClient.setQueryData(queryKeys.districts.detail(district.id), district);
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: queryKeys.districts.all }),
    renamed ? queryClient.invalidateQueries({ queryKey: queryKeys.users.all }) : undefined,
    renamed ? queryClient.invalidateQueries({ queryKey: queryKeys.me }) : undefined,
  ]);
}
