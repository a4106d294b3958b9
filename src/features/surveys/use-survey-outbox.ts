import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { surveyOutbox, type Outbox, type OutboxItem } from './offline-queue';

/** An outbox's items, kept current; sends them when the page opens and whenever the browser comes back online. */
export function useOutbox<B extends { id: string }, D>(
  outbox: Outbox<B, D>,
  queryKey: readonly unknown[],
): { items: OutboxItem<B>[]; retry: () => void; discard: (id: string) => void } {
  const queryClient = useQueryClient();
  const raw = useSyncExternalStore(
    (cb) => outbox.subscribe(cb),
    () => localStorage.getItem(outbox.config.storageKey) ?? '[]',
  );
  const key = JSON.stringify(queryKey);
  useEffect(() => {
    const send = () =>
      void outbox.flush().then((r) => {
        if (r.sent.length) void queryClient.invalidateQueries({ queryKey: JSON.parse(key) as unknown[] });
      });
    if (outbox.items().length) send();
    window.addEventListener('online', send);
    return () => window.removeEventListener('online', send);
  }, [outbox, queryClient, key]);
  let items: OutboxItem<B>[] = [];
  try {
    items = JSON.parse(raw) as OutboxItem<B>[];
  } catch {
    items = [];
  }
  return {
    items,
    retry: () => void outbox.flush().then(() => queryClient.invalidateQueries({ queryKey: JSON.parse(key) as unknown[] })),
    discard: (id) => outbox.discard(id),
  };
}

/** The surveys' outbox, kept current. */
export const useSurveyOutbox = () => useOutbox(surveyOutbox(), ['surveys']);
