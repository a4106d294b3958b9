import { describe, expect, it } from 'vitest';
import { adminMe, demoDistricts, demoUsers, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;
describe('invite form', () => {
  it('when the server rejects fields, then each message shows beside its field', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: demoUsers }),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'POST /api/users': () =>
        json(400, {
          error: {
            code: 'invalid_input',
            message: 'The body is not valid: displayName is too long',
            fields: [{ path: 'displayName', message: 'is too long' }],
          },
        }),
    });
    view = await renderRoutes('/admin/users');
    const form = await waitFor(() => {
      const f = view!.container.querySelector<HTMLFormElement>('form[aria-labelledby="invite-title"]');
      if (!f) throw new Error('no invite form yet');
      return f;
    });

    await typeInto(getByLabel(form, 'E-mail'), 'new.person@halvern.example');
    await typeInto(getByLabel(form, 'Name'), 'New Person');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Role'), 'officer');
    await click(getButton(form, 'Send the invitation'));

    await waitFor(() => expect(form.textContent).toContain('Name is too long.'));
    const nameInput = getByLabel(form, 'Name');
    expect(nameInput.getAttribute('aria-invalid')).toBe('true');
    const sent = fetchMock.mock.calls.find((c) => (c[1] as RequestInit | undefined)?.method === 'POST')!;
    expect(JSON.parse((sent[1] as RequestInit).body as string)).toEqual({
      email: 'new.person@halvern.example',
      displayName: 'New Person',
      role: 'officer',
      language: 'en', // the invitee's language, English unless the admin picks another
      districtIds: [],
    });
  });
});
