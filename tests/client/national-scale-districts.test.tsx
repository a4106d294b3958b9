import { afterEach, describe, expect, it } from 'vitest';
import { adminMe, fakeApi, json } from './support/fake-api';
import { nationalDistricts, nationalRegions } from './support/national-fixtures';
import { click, getButton, getByLabel, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

/** Issue 17, national scale: the Districts screen lists 3,000 districts a page at a time, with a search. */
let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
});

describe('districts screen at national scale', () => {
  it('when 3,000 districts exist, then the list shows 50 at a time, pages on, finds a district by name and marks demo districts', async () => {
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/districts': () => json(200, { districts: nationalDistricts }),
      'GET /api/regions': () => json(200, { regions: nationalRegions }),
      'GET /api/profiles': () => json(200, { profiles: [] }),
      'GET /api/demo': () => json(200, { districts: 12, stations: 0, users: 0 }),
    });
    view = await renderRoutes('/admin/districts');
    const c = view.container;
    await waitFor(() => expect(c.textContent).toContain('Districts 1–50 of 3,000'));
    const rows = () => c.querySelectorAll('table tbody tr');
    expect(rows().length).toBeLessThanOrEqual(50);
    // The assign form's district choice is a search, not 3,000 checkboxes.
    expect(c.querySelectorAll('input[type="checkbox"]').length).toBeLessThan(100);

    await click(getButton(c, 'Next page'));
    await waitFor(() => expect(c.textContent).toContain('Districts 51–100 of 3,000'));
    await typeInto(getByLabel(c, 'Search districts'), 'county 2999');
    await waitFor(() => expect(c.textContent).toContain('Districts 1–1 of 1'));
    expect(rows().length).toBe(1);
    expect(rows()[0].textContent).toContain('C02999');
    // The demo districts carry a mark a screen reader names; the others do not.
    await typeInto(getByLabel(c, 'Search districts'), 'demo');
    await waitFor(() => expect(c.textContent).toContain('Districts 1–12 of 12'));
    expect(c.querySelectorAll('.demo-mark').length).toBe(12);
    expect(c.textContent).toContain('Demo district (invented)');
    await typeInto(getByLabel(c, 'Search districts'), 'nowhere at all');
    await waitFor(() => expect(c.textContent).toContain('No district matches this search.'));
  });
});
