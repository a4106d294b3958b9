import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { adminMe, demoDistricts, demoUsers, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

/** Issue 17: an admin scopes a user to regions on the Users screen, beside districts. */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const regions = [
  { id: id(901), code: 'SF', name: 'Southfen', districtCount: 7 },
  { id: id(902), code: 'NM', name: 'Northmoor', districtCount: 1 },
];
const regional = {
  id: id(103), email: 'epi@halvern.example', displayName: 'Eve Epi', role: 'epidemiologist', active: true, invitePending: false,
  districts: [], regions: [{ id: id(902), code: 'NM', name: 'Northmoor' }], createdAt: '2025-01-03T00:00:00.000Z',
};

let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
});

const bodyOf = (calls: unknown[][], method: string) => {
  const call = calls.find((c) => (c[1] as RequestInit | undefined)?.method === method)!;
  return JSON.parse((call[1] as RequestInit).body as string);
};
const checkbox = (root: HTMLElement, label: string) =>
  [...root.querySelectorAll('label')].find((l) => l.textContent === label)?.querySelector('input') as HTMLInputElement | undefined;

describe('users scoped to regions', () => {
  it('when the admin invites a person and ticks a region, then the invitation carries the region and the list names it', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: [...demoUsers, regional] }),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/regions': () => json(200, { regions }),
      'POST /api/users': (init) => json(201, { ...regional, id: id(104), email: 'new@halvern.example', regions: [regions[0]].map(({ id, code, name }) => ({ id, code, name })), ...JSON.parse(init.body as string), regionIds: undefined }),
    });
    view = await renderRoutes('/admin/users');
    const c = view.container;
    const form = await waitFor(() => {
      const f = c.querySelector<HTMLFormElement>('form[aria-labelledby="invite-title"]');
      if (!f || !checkbox(f, 'Southfen (SF, 7 districts)')) throw new Error('no regions yet');
      return f;
    }, 5000);
    expect(form.textContent).toContain('Regions');
    expect(checkbox(form, 'Northmoor (NM, 1 district)')).toBeDefined();
    // The list says which regions a person is scoped to.
    await waitFor(() => expect(c.textContent).toContain('Regions: Northmoor'), 5000);

    await typeInto(getByLabel(form, 'E-mail'), 'new@halvern.example');
    await typeInto(getByLabel(form, 'Name'), 'New Person');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Role'), 'officer');
    await click(checkbox(form, 'Southfen (SF, 7 districts)')!);
    await click(getButton(form, 'Send the invitation'));
    await waitFor(() => expect(fetchMock.mock.calls.some((c) => (c[1] as RequestInit | undefined)?.method === 'POST')).toBe(true));
    expect(bodyOf(fetchMock.mock.calls, 'POST')).toMatchObject({ email: 'new@halvern.example', role: 'officer', districtIds: [], regionIds: [id(901)] });
  });

  it('when the admin edits a regional user, then their region is ticked and a change sends only the regions', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: [...demoUsers, regional] }),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/regions': () => json(200, { regions }),
      [`PATCH /api/users/${regional.id}`]: () => json(200, { ...regional, regions: [] }),
    });
    view = await renderRoutes('/admin/users');
    const c = view.container;
    const edit = await waitFor(() => {
      const b = [...c.querySelectorAll('button')].find((x) => x.getAttribute('aria-label') === 'Edit Eve Epi');
      if (!b) throw new Error('no edit button yet');
      return b;
    }, 5000);
    await act(async () => edit.click());
    const form = await waitFor(() => {
      const f = c.querySelector<HTMLFormElement>(`form[aria-labelledby="edit-${regional.id}"]`);
      if (!f || !checkbox(f, 'Northmoor (NM, 1 district)')) throw new Error('no edit form yet');
      return f;
    }, 5000);
    expect(checkbox(form, 'Northmoor (NM, 1 district)')!.checked).toBe(true);
    expect(checkbox(form, 'Southfen (SF, 7 districts)')!.checked).toBe(false);
    await click(checkbox(form, 'Southfen (SF, 7 districts)')!);
    await click(checkbox(form, 'Northmoor (NM, 1 district)')!);
    await click(getButton(form, 'Save changes'));
    await waitFor(() => expect(fetchMock.mock.calls.some((c) => (c[1] as RequestInit | undefined)?.method === 'PATCH')).toBe(true));
    const patch = bodyOf(fetchMock.mock.calls, 'PATCH');
    expect(patch).toMatchObject({ regionIds: [id(901)] });
    expect(patch).not.toHaveProperty('districtIds');
    expect(patch).not.toHaveProperty('displayName');
  });
});
