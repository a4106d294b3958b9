import { useSyncExternalStore } from 'react';

/** Whether a CSS media query matches now, following changes (false where `matchMedia` is missing). */
export function useMediaQuery(query: string): boolean {
  return useSyncExternalStore(
    (onChange) => {
      const list = typeof window !== 'undefined' ? window.matchMedia?.(query) : undefined;
      list?.addEventListener?.('change', onChange);
      return () => list?.removeEventListener?.('change', onChange);
    },
    () => (typeof window !== 'undefined' && window.matchMedia?.(query).matches) === true,
    () => false,
  );
}

/** A phone: below 40rem (Tailwind's `sm`), where the Ladder also opens with fewer columns. */
export const PHONE_QUERY = '(max-width: 40rem)';
