import { useCallback, useEffect, useRef, useState, type RefObject } from 'react';

/**
 * A small row window for long tables. @tanstack/react-virtual is not a dependency of Broodcast, and the
 * Ladder's rows all have one fixed height, so the visible slice is plain arithmetic: render only the rows
 * inside the window (plus a margin), and keep the page's height with two spacer rows. This keeps the
 * markup a real <table> (headers, scope, aria-sort) while 5,000 districts scroll smoothly.
 *
 * The page scrolls, not a box inside it: the slice follows where the table's body sits in the browser
 * window (its top above the window's top is how far the person has scrolled into it). When the table sits
 * in a box that scrolls itself (a phone's sideways frame does not count), that box's scroll is added.
 */
export function useRowWindow({
  count,
  rowHeight,
  scrollRef,
  overscan = 8,
  fallbackViewport = 640,
}: {
  count: number;
  rowHeight: number;
  /** The element whose top is the first row's top (the table body, or the frame around the table). */
  scrollRef: RefObject<HTMLElement | null>;
  overscan?: number;
  /** Used before the window has been measured (and where layout is not computed, as in tests). */
  fallbackViewport?: number;
}) {
  const [scrollTop, setScrollTop] = useState(0);
  const [viewport, setViewport] = useState(fallbackViewport);
  const frame = useRef(0);

  const measure = useCallback(() => {
    const el = scrollRef.current;
    if (!el || typeof window === 'undefined') return;
    const top = el.getBoundingClientRect().top;
    setScrollTop(Math.max(0, -top + el.scrollTop));
    setViewport(window.innerHeight || fallbackViewport);
  }, [scrollRef, fallbackViewport]);

  const onScroll = useCallback(() => {
    cancelAnimationFrame(frame.current);
    frame.current = requestAnimationFrame(measure);
  }, [measure]);

  useEffect(() => {
    measure();
    window.addEventListener('scroll', onScroll, { passive: true });
    window.addEventListener('resize', onScroll);
    return () => {
      window.removeEventListener('scroll', onScroll);
      window.removeEventListener('resize', onScroll);
      cancelAnimationFrame(frame.current);
    };
  }, [measure, onScroll]);

  const first = Math.max(0, Math.floor(scrollTop / rowHeight) - overscan);
  const last = Math.min(count, Math.ceil((scrollTop + viewport) / rowHeight) + overscan);
  return {
    first,
    last,
    padTop: first * rowHeight,
    padBottom: Math.max(0, (count - last) * rowHeight),
    onScroll,
  };
}
