import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { bulletinPreviewResponse, bulletinSendResponse, outboxResponse } from '../../../../shared/api/bulletins.schema';
import { api } from '../../../lib/api-client';

export const bulletinKeys = {
  all: ['bulletins'] as const,
  preview: (districtId: string) => ['bulletins', 'preview', districtId] as const,
  outbox: ['outbox'] as const,
};

/** GET /api/bulletins/preview?districtId= (supervisor) — subject, plain text and recipients of this week's bulletin. */
export const bulletinPreviewQueryOptions = (districtId: string) =>
  queryOptions({
    queryKey: bulletinKeys.preview(districtId),
    queryFn: ({ signal }) => api.get(`/api/bulletins/preview?districtId=${encodeURIComponent(districtId)}`, bulletinPreviewResponse, signal),
  });
export const useBulletinPreview = (districtId: string | null) =>
  useQuery({ ...bulletinPreviewQueryOptions(districtId ?? ''), enabled: !!districtId });

/** The HTML preview (its own sandboxed document, for an iframe) and the PDF download. */
export const bulletinHtmlUrl = (districtId: string) => `/api/bulletins/preview/html?districtId=${encodeURIComponent(districtId)}`;
export const bulletinPdfUrl = (districtId: string) => `/api/bulletins/preview/pdf?districtId=${encodeURIComponent(districtId)}`;

/** POST /api/bulletins/send (supervisor, admin) — write this week's bulletins now and queue them. */
export function useSendBulletin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/bulletins/send', {}, bulletinSendResponse),
    onSettled: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: bulletinKeys.all }),
      queryClient.invalidateQueries({ queryKey: bulletinKeys.outbox }),
    ]),
  });
}

/** GET /api/outbox (supervisor, admin) — the delivery log, refreshed every few seconds while open. */
export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: bulletinKeys.outbox,
    queryFn: ({ signal }) => api.get('/api/outbox?limit=100', outboxResponse, signal),
    refetchInterval: 5000,
  });
export const useOutbox = () => useQuery(outboxQueryOptions());
