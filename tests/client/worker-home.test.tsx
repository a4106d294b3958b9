import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { adminMe, fakeApi, json } from './support/fake-api';
import { demoBoard } from './support/board-fixtures';
import { renderRoutes, waitFor, type Rendered } from './support/render';

/** Issue 21 (community worker on a phone): the first screen and the offline banner. */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const workerMe = { ...adminMe, id: id(102), email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker', districts: [{ id: id(2), code: 'HV-02', name: 'Orrin Valley' }] };
const advisory = {
  id: id(700), flagId: id(701), districtId: id(2), districtCode: 'HV-02', districtName: 'Orrin Valley', tier: 'high',
  message: 'Empty standing water around homes this week.', composed: null, actions: [], caution: 'Broodcast estimates.',
  issuedBy: null, issuedAt: '2025-06-02T08:00:00.000Z', expiresAt: '2025-06-09T08:00:00.000Z', current: true, recipients: 3,
};

let view: Rendered | undefined;
let online = true;
Object.defineProperty(navigator, 'onLine', { configurable: true, get: () => online });
afterEach(() => {
  view?.unmount();
  view = undefined;
  online = true;
});

function workerApi() {
  fakeApi({
    'GET /api/me': () => json(200, workerMe),
    'GET /api/board': () => json(200, { ...demoBoard, rows: demoBoard.rows.filter((r) => r.districtId === id(2)) }),
    'GET /api/advisories': () => json(200, { advisories: [advisory] }),
    'GET /api/districts/boundaries': () => json(200, { type: 'FeatureCollection', features: [] }),
  });
}

describe('community worker first screen', () => {
  it('when a worker opens Broodcast, then their own district and its current advisory (with its caution) come before the Ladder, and the cautions are one tap away', async () => {
    workerApi();
    view = await renderRoutes('/');
    const c = view.container;
    await waitFor(() => expect(c.textContent).toContain('Empty standing water around homes this week.'));
    const home = c.querySelector('[data-testid="worker-home"]')!;
    const firstHeading = home.querySelector('h2')!;
    expect(firstHeading.textContent).toBe('Your district: Orrin Valley');
    // The worker's block comes before the one-row Ladder table in reading order.
    const table = c.querySelector('table');
    if (table) expect(home.compareDocumentPosition(table) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    // The advisory carries its caution, and the cautions panel sits closed in a <details>, one tap away.
    const item = [...home.querySelectorAll('li')].find((li) => li.textContent?.includes('Empty standing water'))!;
    expect(item.textContent).toContain('Broodcast estimates; follow the health authority’s instructions.');
    const details = home.querySelector('details')!;
    expect(details.open).toBe(false);
    expect(details.querySelector('summary')?.textContent).toBe('Before you act on these estimates');
  });

  it('when the phone goes offline and back online, then a banner says so and then goes away', async () => {
    workerApi();
    view = await renderRoutes('/');
    const c = view.container;
    await waitFor(() => expect(c.textContent).toContain('Your district: Orrin Valley'));
    expect(c.querySelector('[data-testid="offline-banner"]')).toBeNull();
    await act(async () => {
      online = false;
      window.dispatchEvent(new Event('offline'));
    });
    const banner = c.querySelector('[data-testid="offline-banner"]')!;
    expect(banner.getAttribute('role')).toBe('status');
    expect(banner.textContent).toContain('You are offline.');
    await act(async () => {
      online = true;
      window.dispatchEvent(new Event('online'));
    });
    expect(c.querySelector('[data-testid="offline-banner"]')).toBeNull();
  });
});
