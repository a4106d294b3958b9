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
  problems: [{ index: 2, code: 'C-3', rule: 'boundary_self_intersecting', reason: 'The boundary crosses itself' }],
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
    expect(form.textContent).toContain('Item 2 (C-3): The boundary crosses itself');
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
