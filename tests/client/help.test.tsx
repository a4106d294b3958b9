import { act } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { queryClient } from '../../src/app/query-client';
import { HelpButton } from '../../src/features/help/help-button';
import { TOUR_STEPS, tourSeen } from '../../src/features/help/first-run-tour';
import { HELP_SOURCES, HELP_TOPICS } from '../../src/features/help/help-topics';
import { i18n } from '../../src/i18n';
import { demoBoard, demoBoundaries } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, getButton, render, waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echarts-core', () => ({ echarts: { registerMap: vi.fn() } }));

let view: Rendered | undefined;
beforeEach(() => localStorage.clear());
const press = async (el: Element, key: string) =>
  act(async () => {
    el.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true }));
  });

describe('the "?" help beside a number', () => {
  it('when the "?" is pressed, then a panel says what the number is, how it is computed, its source and its caution, and Escape closes it and returns focus', async () => {
    view = await render(<HelpButton topic="degreeDays" />);
    const c = view.container;
    const button = c.querySelector<HTMLButtonElement>('button.help-button')!;
    expect(button.getAttribute('aria-label')).toBe('About: Degree-days');
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(c.querySelector('[role="dialog"]')).toBeNull();

    await click(button);
    const panel = c.querySelector<HTMLElement>('[role="dialog"]')!;
    expect(panel).not.toBeNull();
    expect(button.getAttribute('aria-expanded')).toBe('true');
    expect(button.getAttribute('aria-controls')).toBe(panel.id);
    expect(document.getElementById(panel.getAttribute('aria-labelledby')!)?.textContent).toBe('Degree-days');
    expect(panel.textContent).toContain('What it is');
    expect(panel.textContent).toContain('How it is computed');
    expect(panel.textContent).toContain('single sine method');
    // The source of the method, as docs/model.md gives it.
    expect(panel.textContent).toContain('McMaster & Wilhelm 1997. Growing degree-days: one equation, two interpretations.');
    expect(panel.textContent).toContain('Baskerville & Emin 1969');
    expect(panel.textContent).toContain('Caution');
    expect(document.activeElement).toBe(panel);

    await press(panel, 'Escape');
    expect(c.querySelector('[role="dialog"]')).toBeNull();
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(document.activeElement).toBe(button);
  });

  it('when the Close button is pressed, then the panel closes and focus is back on the "?"', async () => {
    view = await render(<HelpButton topic="tier" />);
    const button = view.container.querySelector<HTMLButtonElement>('button.help-button')!;
    await click(button);
    const panel = view.container.querySelector<HTMLElement>('[role="dialog"]')!;
    expect(panel.textContent).toContain('Broodcast’s own documented rule');
    await click(getButton(panel, 'Close'));
    expect(view.container.querySelector('[role="dialog"]')).toBeNull();
    expect(document.activeElement).toBe(button);
  });

  it('when every topic is listed, then each has a title, words for what, how and caution in English, and at least one source', () => {
    for (const topic of HELP_TOPICS) {
      for (const part of ['title', 'what', 'how', 'caution']) expect(i18n.exists(`help:topics.${topic}.${part}`), `${topic}.${part}`).toBe(true);
      expect(HELP_SOURCES[topic].length, topic).toBeGreaterThan(0);
    }
  });

  it('when the interface is French, then the panel reads in French and the source stays as published', async () => {
    await i18n.changeLanguage('fr');
    try {
      view = await render(<HelpButton topic="channelZone" />);
      const button = view.container.querySelector<HTMLButtonElement>('button.help-button')!;
      expect(button.getAttribute('aria-label')).toBe('À propos : Canal endémique');
      await click(button);
      const panel = view.container.querySelector<HTMLElement>('[role="dialog"]')!;
      expect(panel.textContent).toContain('Comment c’est calculé');
      expect(panel.textContent).toContain('Bortman M. 1999. Elaboración de corredores o canales endémicos mediante planillas de cálculo.');
    } finally {
      await i18n.changeLanguage('en');
    }
  });
});

async function openLadder(me = officerMe) {
  fakeApi({
    'GET /api/me': () => json(200, me),
    'GET /api/board': () => json(200, demoBoard),
    'GET /api/districts/boundaries': () => json(200, demoBoundaries),
  });
  const opened = await renderRoutes('/');
  view = opened;
  const router = opened.router;
  const c = view.container;
  await waitFor(() => expect(c.querySelector('tr[data-district="HV-01"]')).not.toBeNull(), 3000);
  return c;
}

const tour = () => document.querySelector<HTMLElement>('[data-testid="tour"]');

describe('the first-run tour', () => {
  // happy-dom reports navigator.webdriver = true, as automated browsers do, and the tour leaves those alone;
  // these tests are a person's browser.
  beforeEach(() => {
    Object.defineProperty(navigator, 'webdriver', { value: false, configurable: true });
  });
  afterEach(() => {
    Object.defineProperty(navigator, 'webdriver', { value: true, configurable: true });
  });

  it('when the browser is driven by automation, then the tour does not open by itself but the Tour button opens it', async () => {
    Object.defineProperty(navigator, 'webdriver', { value: true, configurable: true });
    const c = await openLadder();
    await act(async () => new Promise((r) => setTimeout(r, 50)));
    expect(tour()).toBeNull();
    await click(getButton(c, 'Tour'));
    expect(tour()).not.toBeNull();
  });

  it('when an officer first reaches the Ladder, then the tour opens once, steps through the screen and can be skipped; it does not open again for that user', async () => {
    let c = await openLadder();
    await waitFor(() => expect(tour()).not.toBeNull());
    const panel = tour()!;
    expect(panel.getAttribute('role')).toBe('dialog');
    expect(panel.getAttribute('data-step')).toBe('welcome');
    expect(panel.textContent).toContain('As a health officer you land on the Ladder.');
    expect(panel.textContent).toMatch(/Step 1 of \d+/);
    expect(document.activeElement).toBe(panel);
    expect(tourSeen(officerMe.id)).toBe(true);

    await click(getButton(panel, 'Next'));
    expect(tour()!.getAttribute('data-step')).toBe('ladder');
    // The part it points at is ringed.
    expect(c.querySelector('[data-tour="ladder-table"]')!.classList.contains('tour-target')).toBe(true);
    await click(getButton(tour()!, 'Next'));
    expect(tour()!.getAttribute('data-step')).toBe('map');
    await click(getButton(tour()!, 'Back'));
    expect(tour()!.getAttribute('data-step')).toBe('ladder');

    await click(getButton(tour()!, 'Skip the tour'));
    expect(tour()).toBeNull();
    expect(c.querySelector('.tour-target')).toBeNull();
    expect(document.activeElement).toBe(c.querySelector('[data-tour="tour-button"]'));

    view!.unmount();
    queryClient.clear();
    c = await openLadder();
    await act(async () => new Promise((r) => setTimeout(r, 50)));
    expect(tour()).toBeNull();

    // The Tour button opens it again; Escape closes it.
    await click(getButton(c, 'Tour'));
    expect(tour()).not.toBeNull();
    await press(tour()!, 'Escape');
    expect(tour()).toBeNull();
  });

  it('when another user signs in on the same device, then the tour opens for them too, with the steps of their role', async () => {
    localStorage.setItem(`broodcast.tour.seen.${officerMe.id}`, '1');
    const supervisor = { ...officerMe, id: '00000000-0000-4000-8000-000000000199', role: 'supervisor', displayName: 'Sade Supervisor' };
    await openLadder(supervisor as typeof officerMe);
    await waitFor(() => expect(tour()).not.toBeNull());
    expect(tour()!.textContent).toContain('As a supervisor you land on the Ladder.');
    const ids: string[] = [];
    for (;;) {
      ids.push(tour()!.getAttribute('data-step')!);
      const next = [...tour()!.querySelectorAll('button')].find((b) => b.textContent === 'Next' || b.textContent === 'Finish')!;
      const finish = next.textContent === 'Finish';
      await click(next);
      if (finish) break;
    }
    expect(tour()).toBeNull();
    // Every step shown is one of the supervisor's, and the sign-off step is among them.
    const planned = TOUR_STEPS.supervisor.map((s) => s.id);
    expect(ids.every((id) => planned.includes(id))).toBe(true);
    expect(ids).toContain('signOff');
    expect(ids[ids.length - 1]).toBe('end');
  });
});
