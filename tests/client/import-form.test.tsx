import { describe, expect, it } from 'vitest';
import { act } from 'react';
import { adminMe, demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, renderRoutes, typeInto, waitFor } from './support/render';

async function chooseFile(input: HTMLInputElement, name: string, text: string) {
  const file = new File([text], name, { type: 'application/geo+json' });
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  await act(async () => {
    input.dispatchEvent(new Event('change', { bubbles: true }));
  });
}

const report = (dryRun: boolean) => ({
  dryRun, total: 3, created: 2, updated: 0, skipped: 1, problemsNotListed: 0,
  problems: [{ index: 2, code: 'C-3', rule: 'boundary_self_intersecting', params: { points: 2, lon: 10.5, lat: 20.25 } }],
  preview: [{ index: 0, code: 'C-1', name: 'First', action: 'create' }, { index: 1, code: 'C-2', name: 'Second', action: 'create' }],
  regions: { created: 1, updated: 0 }, properties: ['ID', 'NAME'],
});

describe('the import on the Districts screen', () => {
  it('when an admin checks a district file, then the first rows, the properties and the problems show; Import sends the mapping with skipProblems once ticked', async () => {
    const calls: string[] = [];
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/profiles': () => json(200, { profiles: [] }),
      'POST /api/districts/import': () => json(200, report(calls.length === 0)),
    });
    const view = await renderRoutes('/admin/districts');
    const form = await waitFor(() => {
      const f = [...view.container.querySelectorAll('form')].find((x) => x.textContent?.includes('Import from files'));
      if (!f) throw new Error('no import form yet');
      return f;
    });
    await typeInto(getByLabel(form, 'District code'), 'ID');
    await typeInto(getByLabel(form, 'District name'), 'NAME');
    await chooseFile(form.querySelector<HTMLInputElement>('input[type="file"]')!, 'c.geojson', '{}');
    await click(getButton(form, 'Check the file'));
    await waitFor(() => expect(form.textContent).toContain('2 would be created'));
    calls.push('dry');
    expect(form.textContent).toContain('Second');
    // The server sends the rule and its parameters; the panel words them in the person's language.
    expect(form.textContent).toContain('Item 2 (C-3): the boundary crosses itself (2 crossing points, the first near 10.5, 20.25)');
    expect(form.textContent).toContain('Properties found in the file: ID, NAME');
    expect(getButton(form, 'Import').disabled).toBe(true);
    await click(getByLabel(form, 'Import the other items and leave these out'));
    await click(getButton(form, 'Import'));
    await waitFor(() => expect(form.textContent).toContain('Imported: 2 created'));
    const posts = fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'POST');
    expect(String(posts[0][0])).toContain('dryRun=true');
    expect(String(posts[1][0])).toContain('skipProblems=true');
    const body = (posts[1][1] as RequestInit).body as FormData;
    expect(body.get('codeProperty')).toBe('ID');
    expect(body.get('nameProperty')).toBe('NAME');
  });
});

describe('import problems in four languages', () => {
  it('when a problem comes as a rule with parameters, then each language words it, a CSV line names its line, and an unknown rule shows its code', async () => {
    const { i18n } = await import('../../src/i18n');
    const { problemText } = await import('../../src/features/districts/components/import.form');
    const t = (lng: string) => i18n.getFixedT(lng);
    expect(problemText(t('en'), { rule: 'code_repeated', params: { feature: 4 } })).toBe('the code is also used by item 4');
    expect(problemText(t('en'), { rule: 'code_repeated', params: { line: 7 } })).toBe('the code is also on line 7');
    expect(problemText(t('fr'), { rule: 'row_invalid', params: { field: 'latitude' } })).toBe('la valeur de «\u202flatitude\u202f» n’est pas valide');
    expect(problemText(t('es'), { rule: 'unknown_district', params: {} })).toBe('ningún distrito tiene este código');
    expect(problemText(t('pt'), { rule: 'name_too_long', params: { max: 120 } })).toBe('o nome tem mais de 120 caracteres');
    expect(problemText(t('en'), { rule: 'a_new_rule', params: {} })).toBe('it breaks the rule “a_new_rule”');
  });
});
