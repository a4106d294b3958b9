import { useCallback, useEffect, useRef, useState, type RefObject } from 'react';

/**
 * A small row window for long tables. @tanstack/react-virtual is not a dependency of Broodcast, and the
 * Ladder's rows all have one fixed height, so the visible slice is plain arithmetic: render only the rows
 * inside the scroll box (plus a margin), and keep the scroll height with two spacer rows. This keeps the
 * markup a real <table> (headers, scope, aria-sort) while 5,000 districts scroll smoothly.
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
  scrollRef: RefObject<HTMLElement | null>;
  overscan?: number;
  /** Used before the box has been measured (and where layout is not computed, as in tests). */
  fallbackViewport?: number;
}) {
  const [scrollTop, setScrollTop] = useState(0);
  const [viewport, setViewport] = useState(fallbackViewport);
  const frame = useRef(0);

  useEffect(() => {
    const el = scrollRef.current;
    if (!el) return;
    const measure = () => setViewport(el.clientHeight || fallbackViewport);
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    return () => observer.disconnect();
  }, [scrollRef, fallbackViewport]);

  useEffect(() => () => cancelAnimationFrame(frame.current), []);

  const onScroll = useCallback(() => {
    cancelAnimationFrame(frame.current);
    frame.current = requestAnimationFrame(() => setScrollTop(scrollRef.current?.scrollTop ?? 0));
  }, [scrollRef]);

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
