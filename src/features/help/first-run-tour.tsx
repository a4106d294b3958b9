import { useCallback, useEffect, useId, useLayoutEffect, useRef, useState, type KeyboardEvent } from 'react';
import { useTranslation } from 'react-i18next';
import type { Role } from '../../../shared/roles';
import './help.css';

/** One step: its words are `help:tour.steps.<id>.{title,body}`; `target` is the part of the screen it points at. */
export type TourStep = { id: string; target?: string };

const LADDER: TourStep = { id: 'ladder', target: '[data-tour="ladder-table"]' };
const MAP: TourStep = { id: 'map', target: '[data-tour="region-map"]' };
const HELP: TourStep = { id: 'help', target: '[data-tour="ladder-table"] .help-button' };
const CAUTIONS: TourStep = { id: 'cautions', target: '[data-tour="cautions"]' };
const nav = (id: string, to: string): TourStep => ({ id, target: `nav a[href="${to}"]` });
const END: TourStep = { id: 'end', target: '[data-tour="tour-button"]' };

/**
 * The steps per role, on the screen every role lands on (the Ladder), pointing at what that role does
 * first. A step whose part is not on the screen (a menu item the role lacks) is left out when the tour opens.
 */
export const TOUR_STEPS: Record<Role, readonly TourStep[]> = {
  officer: [{ id: 'welcome' }, LADDER, MAP, HELP, nav('intake', '/intake'), nav('seasonRuns', '/season-runs'), nav('surveys', '/surveys'), CAUTIONS, END],
  epidemiologist: [{ id: 'welcome' }, LADDER, HELP, nav('caseLedger', '/cases'), MAP, CAUTIONS, END],
  supervisor: [{ id: 'welcome' }, LADDER, nav('signOff', '/sign-off'), nav('bulletin', '/bulletin'), HELP, CAUTIONS, END],
  worker: [{ id: 'welcome' }, { id: 'ownDistrict', target: LADDER.target }, nav('surveys', '/surveys'), nav('advisories', '/advisories'), CAUTIONS, END],
  admin: [{ id: 'welcome' }, LADDER, nav('users', '/admin/users'), nav('districts', '/admin/districts'), nav('seasonRuns', '/season-runs'), HELP, END],
};

const storageKey = (userId: string) => `broodcast.tour.seen.${userId}`;

export function tourSeen(userId: string): boolean {
  try {
    return globalThis.localStorage?.getItem(storageKey(userId)) === '1';
  } catch {
    return false;
  }
}

export function markTourSeen(userId: string): void {
  try {
    globalThis.localStorage?.setItem(storageKey(userId), '1');
  } catch {
    // not remembered on this device: the tour may show once more
  }
}

/**
 * Opens the tour by itself the first time this user (by id) reaches the screen — remembered in
 * localStorage, so it shows once — and on demand from the "Tour" button. A browser driven by automation
 * (navigator.webdriver) does not get it by itself, so automated checks see the bare screen.
 */
export function useFirstRunTour(userId: string, ready: boolean) {
  const [open, setOpen] = useState(false);
  useEffect(() => {
    if (!ready || tourSeen(userId)) return;
    if (globalThis.navigator?.webdriver) return;
    markTourSeen(userId);
    setOpen(true);
  }, [ready, userId]);
  return { open, start: useCallback(() => setOpen(true), []), close: useCallback(() => setOpen(false), []) };
}

/** The "Tour" button that reopens the tour. */
export function TourButton({ onClick }: { onClick: () => void }) {
  const { t } = useTranslation('help');
  return (
    <button type="button" className="btn btn-secondary btn-small tour-button" onClick={onClick} data-tour="tour-button" aria-haspopup="dialog">
      {t('tour.button')}
    </button>
  );
}

const present = (s: TourStep) => !s.target || !!document.querySelector(s.target);

/**
 * The tour itself: a non-modal dialog beside the part of the screen it points at (ringed), with Back,
 * Next / Finish and "Skip the tour". Keyboard: it takes focus when it opens and at each step; Escape
 * skips; focus goes back to the Tour button when it closes.
 */
export function FirstRunTour({ role, open, onClose }: { role: Role; open: boolean; onClose: () => void }) {
  const { t } = useTranslation('help');
  const id = useId();
  const [steps, setSteps] = useState<readonly TourStep[]>([]);
  const [index, setIndex] = useState(0);
  const [place, setPlace] = useState<{ top: number; left: number } | null>(null);
  const panelRef = useRef<HTMLDivElement>(null);

  useLayoutEffect(() => {
    if (!open) return;
    setSteps(TOUR_STEPS[role].filter(present));
    setIndex(0);
  }, [open, role]);

  const step = open ? steps[index] : undefined;

  useLayoutEffect(() => {
    if (!step) return;
    const target = step.target ? document.querySelector<HTMLElement>(step.target) : null;
    target?.classList.add('tour-target');
    target?.scrollIntoView?.({ block: 'nearest' });
    const position = () => {
      const vw = window.innerWidth || 1024;
      const vh = window.innerHeight || 768;
      const width = Math.min(384, vw - 16);
      const r = target?.getBoundingClientRect();
      if (!r || (r.width === 0 && r.height === 0)) {
        setPlace({ top: Math.max(16, vh / 2 - 120), left: Math.max(8, (vw - width) / 2) });
        return;
      }
      // Beside the part it points at: below it, else above it, else (a part taller than the screen) in the
      // lower right corner, where it covers the least.
      const height = panelRef.current?.offsetHeight || 220;
      const left = Math.max(8, Math.min(r.left, vw - width - 8));
      if (vh - r.bottom - 12 >= height + 8) setPlace({ top: r.bottom + 12, left });
      else if (r.top - 12 >= height + 8) setPlace({ top: r.top - 12 - height, left });
      else setPlace({ top: Math.max(8, vh - height - 16), left: Math.max(8, vw - width - 16) });
    };
    position();
    panelRef.current?.focus();
    window.addEventListener('resize', position);
    return () => {
      target?.classList.remove('tour-target');
      window.removeEventListener('resize', position);
    };
  }, [step]);

  const finish = () => {
    onClose();
    // Back to the button that reopens it (or the screen's content when it is not there).
    const back = document.querySelector<HTMLElement>('[data-tour="tour-button"]') ?? document.getElementById('main');
    back?.focus();
  };

  if (!step) return null;
  const last = index === steps.length - 1;
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape') {
      e.preventDefault();
      finish();
    }
  };
  const title = step.id === 'welcome' ? t('tour.steps.welcome.title') : t(`tour.steps.${step.id}.title`);
  const body = step.id === 'welcome' ? t(`tour.welcome.${role}`) : t(`tour.steps.${step.id}.body`);
  return (
    <div
      ref={panelRef}
      role="dialog"
      aria-modal="false"
      aria-labelledby={`${id}-title`}
      aria-describedby={`${id}-body`}
      tabIndex={-1}
      className="tour-panel"
      style={place ? { top: place.top, left: place.left } : undefined}
      onKeyDown={onKeyDown}
      data-testid="tour"
      data-step={step.id}
    >
      <p className="text-xs font-bold uppercase tracking-wide text-ink-muted">{t('tour.progress', { step: index + 1, total: steps.length })}</p>
      <h2 id={`${id}-title`} className="mt-1 text-lg font-bold">
        {title}
      </h2>
      <p id={`${id}-body`} className="mt-2 text-sm leading-relaxed">
        {body}
      </p>
      <div className="mt-4 flex flex-wrap items-center gap-2">
        <button type="button" className="btn btn-quiet btn-small" onClick={finish}>
          {t('tour.skip')}
        </button>
        <span className="ml-auto flex gap-2">
          {index > 0 ? (
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setIndex((i) => i - 1)}>
              {t('tour.back')}
            </button>
          ) : null}
          <button type="button" className="btn btn-primary btn-small" onClick={() => (last ? finish() : setIndex((i) => i + 1))}>
            {last ? t('tour.finish') : t('tour.next')}
          </button>
        </span>
      </div>
    </div>
  );
}
