import { useCallback, useEffect, useRef, useState } from 'react';
import { NavLink, useLocation } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { Role } from '../../shared/roles';
import { navItemsFor, type NavItem } from './navigation';

type Overflow = { before: boolean; after: boolean };

/**
 * The main menu. On a narrow screen (a phone at 360 px, an officer's or admin's ten items) the row scrolls
 * sideways; a fade with an arrow at each edge that has more items says so, and the arrow scrolls the row by
 * most of its width. The arrows are a pointer aid only (`aria-hidden`, out of the tab order): every link is
 * in the list for a screen reader, and a link reached with Tab scrolls itself into view. The page's own item
 * is brought into view when the page opens, so the reader sees where they are.
 * Hand-written (a few lines of scroll arithmetic) rather than a carousel package, which would bring
 * slides, snapping and its own keyboard model to what is a plain list of links.
 */
export function MainNav({ role }: { role: Role }) {
  const { t, i18n } = useTranslation('app');
  const items = navItemsFor(role);
  const list = useRef<HTMLUListElement>(null);
  const location = useLocation();
  const [overflow, setOverflow] = useState<Overflow>({ before: false, after: false });
  // A menu item added without its own `app:nav.<id>` key still shows, in its English label.
  const navLabel = (item: NavItem) => (i18n.exists(`nav.${item.id}`, { ns: 'app' }) ? t(`nav.${item.id}`) : item.label);

  const measure = useCallback(() => {
    const el = list.current;
    if (!el) return;
    const slack = 2; // sub-pixel rounding at the ends
    const next = { before: el.scrollLeft > slack, after: el.scrollLeft + el.clientWidth < el.scrollWidth - slack };
    setOverflow((prev) => (prev.before === next.before && prev.after === next.after ? prev : next));
  }, []);

  useEffect(() => {
    const el = list.current;
    if (!el) return;
    measure();
    el.addEventListener('scroll', measure, { passive: true });
    window.addEventListener('resize', measure);
    const observer = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(measure);
    observer?.observe(el);
    return () => {
      el.removeEventListener('scroll', measure);
      window.removeEventListener('resize', measure);
      observer?.disconnect();
    };
  }, [measure, i18n.language]);

  // The current page's item in view (only the row scrolls, never the page).
  useEffect(() => {
    const el = list.current;
    const current = el?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!el || !current || el.scrollWidth <= el.clientWidth) return;
    const left = current.getBoundingClientRect().left - el.getBoundingClientRect().left + el.scrollLeft;
    if (left < el.scrollLeft || left + current.offsetWidth > el.scrollLeft + el.clientWidth) {
      el.scrollLeft = Math.max(0, left - el.clientWidth / 4);
    }
    measure();
  }, [location.pathname, measure]);

  const scrollBy = (direction: 1 | -1) => {
    const el = list.current;
    if (!el) return;
    el.scrollBy({ left: direction * el.clientWidth * 0.75, behavior: 'smooth' });
  };

  return (
    <nav aria-label={t('layout.mainNav')} className="app-nav">
      <div className="relative mx-auto w-full max-w-6xl">
        <ul ref={list} className="nav-list flex gap-1 overflow-x-auto px-2 sm:px-4" data-more-before={overflow.before} data-more-after={overflow.after}>
          {items.map((item) => (
            <li key={item.id} className="shrink-0">
              <NavLink to={item.to} end={item.to === '/'} className="nav-link">
                {navLabel(item)}
              </NavLink>
            </li>
          ))}
        </ul>
        {overflow.before ? (
          <button type="button" className="nav-more nav-more-before" aria-hidden="true" tabIndex={-1} data-testid="nav-more-before" onClick={() => scrollBy(-1)}>
            ‹
          </button>
        ) : null}
        {overflow.after ? (
          <button type="button" className="nav-more nav-more-after" aria-hidden="true" tabIndex={-1} data-testid="nav-more-after" onClick={() => scrollBy(1)}>
            ›
          </button>
        ) : null}
      </div>
    </nav>
  );
}
