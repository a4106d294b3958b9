import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { subscriptionsResponse, unsubscribeResponse, type SubscriptionsBody } from '../../../../shared/api/bulletins.schema';
import { api } from '../../../lib/api-client';

export const subscriptionsKey = ['subscriptions', 'me'] as const;

/** GET /api/subscriptions/me — what the signed-in person receives for each district they may receive. */
export const subscriptionsQueryOptions = () =>
  queryOptions({ queryKey: subscriptionsKey, queryFn: ({ signal }) => api.get('/api/subscriptions/me', subscriptionsResponse, signal) });
export const useSubscriptions = () => useQuery(subscriptionsQueryOptions());

/** PUT /api/subscriptions/me — save the choice for every district (left out: nothing). */
export function useSaveSubscriptions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SubscriptionsBody) => api.put('/api/subscriptions/me', body, subscriptionsResponse),
    onSuccess: (data) => queryClient.setQueryData(subscriptionsKey, data),
  });
}

/** POST /api/unsubscribe/:token — the one-click link from a mail; no session needed. */
export const useUnsubscribe = () =>
  useMutation({ mutationFn: (token: string) => api.post(`/api/unsubscribe/${encodeURIComponent(token)}`, {}, unsubscribeResponse) });
