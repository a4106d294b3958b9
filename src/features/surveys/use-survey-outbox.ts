import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { OUTBOX_KEY, surveyOutbox, type OutboxItem } from './offline-queue';

/** The outbox's surveys, kept current; sends them when the page opens and whenever the browser comes back online. */
export function useSurveyOutbox(): { items: OutboxItem[]; retry: () => void; discard: (id: string) => void } {
  const outbox = surveyOutbox();
  const queryClient = useQueryClient();
  const raw = useSyncExternalStore(
    (cb) => outbox.subscribe(cb),
    () => localStorage.getItem(OUTBOX_KEY) ?? '[]',
  );
  useEffect(() => {
    const send = () =>
      void outbox.flush().then((r) => {
        if (r.sent.length) void queryClient.invalidateQueries({ queryKey: ['surveys'] });
      });
    if (outbox.items().length) send();
    window.addEventListener('online', send);
    return () => window.removeEventListener('online', send);
  }, [outbox, queryClient]);
  let items: OutboxItem[] = [];
  try {
    items = JSON.parse(raw) as OutboxItem[];
  } catch {
    items = [];
  }
  return {
    items,
    retry: () => void outbox.flush().then(() => queryClient.invalidateQueries({ queryKey: ['surveys'] })),
    discard: (id) => outbox.discard(id),
  };
}
