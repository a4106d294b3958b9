import { describe, expect, it } from 'vitest';
import { adminMe, demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, typeInto, waitFor, renderRoutes } from './support/render';

const profile = (id: string, name: string) => ({
  id, name, vector: 'v', pathogen: 'p', summary: 's', kind: 'published', baseProfileId: null, defaultBiofix: '01-01',
  parameters: [], createdBy: null, createdAt: null,
});

describe('assigning profiles on the Districts screen', () => {
  it('when the biofix is not a real month-day, then it is named and nothing is sent; once fixed, the districts, profiles, biofix and reason are sent', async () => {
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/profiles': () => json(200, { profiles: [profile('aedes-aegypti-dengue', 'Aedes aegypti dengue'), profile('culex-wnv', 'Culex West Nile')] }),
      'PUT /api/districts/profiles': () => json(200, { updated: 1 }),
    });
    const view = await renderRoutes('/admin/districts');
    const form = await waitFor(() => {
      const f = view.container.querySelector<HTMLFormElement>('form[aria-labelledby="assign-profiles-title"]');
      if (!f || !f.textContent?.includes('Culex West Nile')) throw new Error('no assignment form yet');
      return f;
    });
    await click(getByLabel(form, 'HV-01 – Saltmarsh Coast'));
    await click(getByLabel(form, 'Aedes aegypti dengue'));
    await typeInto(getByLabel(form, 'Biofix for Aedes aegypti dengue (MM-DD)'), '02-30');
    await typeInto(getByLabel(form, 'Reason'), 'national set-up');
    await click(getButton(form, 'Assign'));
    await waitFor(() => expect(form.textContent).toContain('Give a real month-day as MM-DD'));
    const puts = () => fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'PUT');
    expect(puts()).toHaveLength(0);

    await typeInto(getByLabel(form, 'Biofix for Aedes aegypti dengue (MM-DD)'), '02-29');
    await click(getButton(form, 'Assign'));
    await waitFor(() => expect(form.textContent).toContain('Profiles assigned to 1 district.'));
    expect(JSON.parse((puts()[0][1] as RequestInit).body as string)).toEqual({
      districtIds: [demoDistricts[0].id],
      profiles: [{ profileId: 'aedes-aegypti-dengue', biofix: '02-29' }],
      reason: 'national set-up',
    });
  });
});

describe('the Profiles screen', () => {
  it('when an admin opens Profiles, then each parameter shows its central, low and high values and its source', async () => {
    const withParams = {
      ...profile('aedes-aegypti-dengue', 'Aedes aegypti dengue'),
      parameters: [{ path: 'development.degreeDaysPerGeneration', value: 135.2, low: 134.8, high: 153.6, unit: 'degree-days', tag: 'derived',
        source: { author: 'Mordecai et al.', year: 2017, title: 'Detecting the impact of temperature on transmission', journal: 'PLoS Negl. Trop. Dis.' }, note: null }],
    };
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/profiles': () => json(200, { profiles: [withParams] }),
    });
    const view = await renderRoutes('/admin/profiles');
    const row = await waitFor(() => {
      const r = [...view.container.querySelectorAll('tr')].find((x) => x.textContent?.includes('development.degreeDaysPerGeneration'));
      if (!r) throw new Error('no parameter row yet');
      return r;
    });
    expect(row.textContent).toContain('135.2 degree-days');
    expect(row.textContent).toContain('134.8');
    expect(row.textContent).toContain('153.6');
    expect(row.textContent).toContain('Mordecai et al. (2017)');
    expect(view.container.querySelector('form[aria-labelledby="variant-title"]')).not.toBeNull();
  });
});
