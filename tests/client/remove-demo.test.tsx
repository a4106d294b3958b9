import { afterEach, describe, expect, it } from 'vitest';
import { adminMe, demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

/** Issue 17: the admin removes the demo region from the Districts screen, after a confirmation on screen. */
let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
});

describe('removing the demo region on the Districts screen', () => {
  it('when the admin asks, then the screen says what goes and needs a reason before it removes; the answer is shown', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/regions': () => json(200, { regions: [] }),
      'GET /api/profiles': () => json(200, { profiles: [] }),
      'GET /api/demo': () => json(200, { districts: 12, stations: 11, users: 5 }),
      'POST /api/demo/remove': () => json(200, { districts: 12, stations: 11, usersDeactivated: 4 }),
    });
    view = await renderRoutes('/admin/districts');
    const c = view.container;
    const panel = await waitFor(() => {
      const p = c.querySelector<HTMLElement>('[data-testid="remove-demo"]');
      if (!p) throw new Error('no panel yet');
      return p;
    }, 5000);
    expect(panel.textContent).toContain('Remove the demo region');
    await click(getButton(panel, 'Remove the demo region…'));
    expect(panel.textContent).toContain('Remove 12 demo districts with all their data and 11 demo stations');
    const yes = getButton(panel, 'Yes, remove the demo region');
    expect(yes.disabled).toBe(true);
    expect(fetchMock.mock.calls.some((call) => (call[1] as RequestInit | undefined)?.method === 'POST')).toBe(false);
    await typeInto(getByLabel(panel, 'Reason (kept in the audit trail)'), 'our own districts are in');
    expect(yes.disabled).toBe(false);
    await click(yes);
    await waitFor(() => expect(c.textContent).toContain('The demo region is removed: 12 districts and 11 stations deleted, 4 demo accounts deactivated.'), 3000);
    const post = fetchMock.mock.calls.find((call) => (call[1] as RequestInit | undefined)?.method === 'POST')!;
    expect(JSON.parse((post[1] as RequestInit).body as string)).toEqual({ confirm: true, reason: 'our own districts are in' });
  });
});
