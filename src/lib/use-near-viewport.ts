import { useEffect, useState, type RefObject } from 'react';

/**
 * True once `ref`'s element has come within `margin` of the viewport, and from then on. Below-the-fold
 * parts (the Ladder's region map on a phone) fetch their code only when the reader scrolls towards them,
 * so a cold start on a slow network carries only what the first screen shows (docs/offline.md).
 * Where `eagerMedia` matches (a wide screen, usually on a wired or office network) or without
 * IntersectionObserver (very old browsers), the part loads at once.
 */
export function useNearViewport(ref: RefObject<Element | null>, enabled: boolean, eagerMedia?: string, margin = '300px'): boolean {
  const [near, setNear] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!enabled || near || !el) return;
    if (typeof IntersectionObserver === 'undefined' || (eagerMedia && window.matchMedia?.(eagerMedia).matches)) {
      setNear(true);
      return;
    }
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setNear(true);
    }, { rootMargin: margin });
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref, enabled, near, eagerMedia, margin]);
  return near;
}
