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

const unsubscribePath = (token: string) => `/api/unsubscribe/${encodeURIComponent(token)}`;

/** GET /api/unsubscribe/:token — what the link in a mail would stop, and for whom (changes nothing); no session needed. */
export const unsubscribeLinkQueryOptions = (token: string | null) =>
  queryOptions({
    queryKey: ['unsubscribe', token],
    queryFn: ({ signal }) => api.get(unsubscribePath(token!), unsubscribeResponse, signal),
    enabled: !!token,
    retry: false,
    staleTime: Infinity,
  });
export const useUnsubscribeLink = (token: string | null) => useQuery(unsubscribeLinkQueryOptions(token));

/** POST /api/unsubscribe/:token — stop the mail the link names (the confirmation page's button); no session needed. */
export const useUnsubscribe = () =>
  useMutation({ mutationFn: (token: string) => api.post(unsubscribePath(token), {}, unsubscribeResponse) });

/** POST /api/unsubscribe/:token/undo — put the stopped mail back; no session needed. */
export const useUndoUnsubscribe = () =>
  useMutation({ mutationFn: (token: string) => api.post(`${unsubscribePath(token)}/undo`, {}, unsubscribeResponse) });
