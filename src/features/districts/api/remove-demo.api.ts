import { useMutation, useQueryClient } from '@tanstack/react-query';
import { demoRemovedResponse, type DemoRemoveBody } from '../../../../shared/api/demo.schema';
import { api } from '../../../lib/api-client';

/** POST /api/demo/remove (admin) — removes the demo region in one transaction; every screen's data changes. */
export const removeDemo = (body: DemoRemoveBody) => api.post('/api/demo/remove', body, demoRemovedResponse);

export function useRemoveDemo() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeDemo,
    // Districts, stations, the board, users and more all lose the demo's rows: refetch everything.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
