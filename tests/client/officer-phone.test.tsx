import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { fakeApi, json, officerMe } from './support/fake-api';
import { demoBoard } from './support/board-fixtures';
import { renderRoutes, waitFor, type Rendered } from './support/render';

/** Issue 21 (officer, supervisor, epidemiologist, admin at 360 × 740): the menu's cue and the Ladder first. */
let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
  vi.restoreAllMocks();
});

function screenWidth(phone: boolean) {
  vi.spyOn(window, 'matchMedia').mockImplementation((query: string) => ({
    matches: phone ? query.includes('max-width') : query.includes('min-width'), media: query, onchange: null,
    addListener: () => {}, removeListener: () => {}, addEventListener: () => {}, removeEventListener: () => {}, dispatchEvent: () => false,
  }) as MediaQueryList);
}

async function openLadder() {
  fakeApi({
    'GET /api/me': () => json(200, officerMe),
    'GET /api/board': () => json(200, demoBoard),
    'GET /api/districts/boundaries': () => json(200, { type: 'FeatureCollection', features: [] }),
    'GET /api/advisories': () => json(200, { advisories: [] }),
  });
  view = await renderRoutes('/');
  await waitFor(() => expect(view!.container.textContent).toContain('Saltmarsh Coast'));
  return view.container;
}

/** Gives the menu row the widths a browser would (happy-dom lays nothing out). */
function sizeRow(list: HTMLElement, { scrollWidth, clientWidth, scrollLeft }: { scrollWidth: number; clientWidth: number; scrollLeft: number }) {
  Object.defineProperty(list, 'scrollWidth', { configurable: true, value: scrollWidth });
  Object.defineProperty(list, 'clientWidth', { configurable: true, value: clientWidth });
  Object.defineProperty(list, 'scrollLeft', { configurable: true, writable: true, value: scrollLeft });
}

describe('the officer on a phone', () => {
  it('when the menu row is wider than the screen, then an arrow over a fade marks the side with more items, outside the tab order, and every link stays in the list', async () => {
    screenWidth(true);
    const c = await openLadder();
    const nav = c.querySelector('nav[aria-label="Main"]')!;
    const list = nav.querySelector('ul')!;
    expect(nav.querySelector('[data-testid="nav-more-after"]')).toBeNull();

    sizeRow(list, { scrollWidth: 900, clientWidth: 360, scrollLeft: 0 });
    await act(async () => window.dispatchEvent(new Event('resize')));
    const after = nav.querySelector<HTMLButtonElement>('[data-testid="nav-more-after"]')!;
    expect(after).not.toBeNull();
    expect(after.getAttribute('aria-hidden')).toBe('true');
    expect(after.tabIndex).toBe(-1);
    expect(after.className).toContain('nav-more-after');
    expect(nav.querySelector('[data-testid="nav-more-before"]')).toBeNull();
    expect(list.getAttribute('data-more-after')).toBe('true');

    // Scrolled to the far end: the cue moves to the start.
    sizeRow(list, { scrollWidth: 900, clientWidth: 360, scrollLeft: 540 });
    await act(async () => list.dispatchEvent(new Event('scroll')));
    expect(nav.querySelector('[data-testid="nav-more-after"]')).toBeNull();
    expect(nav.querySelector('[data-testid="nav-more-before"]')).not.toBeNull();

    // The links themselves are all there, for the keyboard and a screen reader.
    const labels = [...list.querySelectorAll('a')].map((a) => a.textContent);
    expect(labels).toEqual(expect.arrayContaining(['Ladder', 'Advisories', 'Settings']));
  });

  it('when an officer opens the Ladder on a phone, then the Ladder leads and the cautions wait closed, one tap away, with a one-line caution in view', async () => {
    screenWidth(true);
    const c = await openLadder();
    const details = c.querySelector<HTMLDetailsElement>('[data-testid="cautions-disclosure"]')!;
    expect(details.tagName).toBe('DETAILS');
    expect(details.open).toBe(false);
    const summary = details.querySelector('summary')!;
    expect(summary.textContent).toContain('Before you act on these estimates');
    expect(summary.textContent).toContain('Broodcast estimates; it does not diagnose or predict with certainty. Follow the health authority.');
    // The full cautions are inside, one tap away.
    expect(details.querySelector('aside.cautions')?.textContent).toContain('A tier is an estimate, not a measurement.');
    // Nothing open above the Ladder table but that one closed line.
    const table = c.querySelector('table')!;
    expect(details.compareDocumentPosition(table) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(c.querySelectorAll('aside.cautions')).toHaveLength(1);
  });

  it('when the screen is wide, then the whole cautions panel shows above the Ladder as before', async () => {
    screenWidth(false);
    const c = await openLadder();
    expect(c.querySelector('[data-testid="cautions-disclosure"]')).toBeNull();
    const panel = c.querySelector('[data-tour="cautions"] aside.cautions')!;
    expect(panel.textContent).toContain('A tier is an estimate, not a measurement.');
  });
});
