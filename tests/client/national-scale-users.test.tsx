import { afterEach, describe, expect, it } from 'vitest';
import { adminMe, demoUsers, fakeApi, json } from './support/fake-api';
import { nationalDistricts, nationalRegions } from './support/national-fixtures';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

/** Issue 17, national scale: the invite form picks among 3,000 districts without listing them all. */
let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
});

const checkbox = (root: HTMLElement, label: string) =>
  [...root.querySelectorAll('label')].find((l) => l.textContent === label)?.querySelector('input') as HTMLInputElement | undefined;

describe('users at national scale', () => {
  it('when 3,000 districts exist, then the invite form shows a search instead of 3,000 checkboxes, and a searched district is added as a chip and sent', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: demoUsers }),
      'GET /api/districts': () => json(200, { districts: nationalDistricts }),
      'GET /api/regions': () => json(200, { regions: nationalRegions }),
      'POST /api/users': (init) => json(201, { ...demoUsers[1], ...JSON.parse(init.body as string), districts: [], regions: [] }),
    });
    view = await renderRoutes('/admin/users');
    const form = await waitFor(() => {
      const f = view!.container.querySelector<HTMLFormElement>('form[aria-labelledby="invite-title"]');
      if (!f || !f.textContent?.includes('3,000 matches')) throw new Error('no districts yet');
      return f;
    });
    // At most a few dozen checkboxes (districts and regions each show 24 at most), never thousands.
    expect(form.querySelectorAll('input[type="checkbox"]').length).toBeLessThanOrEqual(48);
    expect(form.textContent).toContain('Showing 24 of 3,000 matches');

    await typeInto(getByLabel(form, 'Search: Districts'), 'county 2999');
    await waitFor(() => expect(checkbox(form, 'C02999 — County 2999')).toBeDefined());
    await click(checkbox(form, 'C02999 — County 2999')!);
    await waitFor(() => expect(form.textContent).toContain('1 chosen'));
    // The chip names it and can remove it again; the search ignores case and accents.
    await typeInto(getByLabel(form, 'Search: Districts'), 'DÉMO district 7');
    await waitFor(() => expect(checkbox(form, 'HV-07 — Demo District 7')).toBeDefined());
    await click(checkbox(form, 'HV-07 — Demo District 7')!);
    await waitFor(() => expect(form.querySelectorAll('.picker-chip').length).toBe(2));
    await click(form.querySelector<HTMLButtonElement>('button[aria-label="Remove HV-07 — Demo District 7"]')!);
    await waitFor(() => expect(form.querySelectorAll('.picker-chip').length).toBe(1));

    await typeInto(getByLabel(form, 'E-mail'), 'county.officer@example.org');
    await typeInto(getByLabel(form, 'Name'), 'County Officer');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Role'), 'officer');
    await click(getButton(form, 'Send the invitation'));
    await waitFor(() => expect(fetchMock.mock.calls.some((c) => (c[1] as RequestInit | undefined)?.method === 'POST')).toBe(true));
    const sent = fetchMock.mock.calls.find((c) => (c[1] as RequestInit | undefined)?.method === 'POST')!;
    expect(JSON.parse((sent[1] as RequestInit).body as string).districtIds).toEqual([nationalDistricts[2998].id]);
  });

  it('when the search matches nothing, then the form says so and nothing is chosen', async () => {
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: demoUsers }),
      'GET /api/districts': () => json(200, { districts: nationalDistricts }),
      'GET /api/regions': () => json(200, { regions: nationalRegions }),
    });
    view = await renderRoutes('/admin/users');
    const form = await waitFor(() => {
      const f = view!.container.querySelector<HTMLFormElement>('form[aria-labelledby="invite-title"]');
      if (!f || !f.textContent?.includes('3,000 matches')) throw new Error('no districts yet');
      return f;
    });
    await typeInto(getByLabel(form, 'Search: Districts'), 'no such place');
    await waitFor(() => expect(form.textContent).toContain('Nothing matches this search.'));
    expect(form.textContent).toContain('0 chosen');
  });
});
