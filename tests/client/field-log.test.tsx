import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { FIELD_RECORDS_OUTBOX_KEY } from '../../src/features/field-log/field-record-outbox';
import { fieldRecordsCsv } from '../../src/features/field-log/field-records.csv';
import { demoDistricts, fakeApi, json, officerMe } from './support/fake-api';
import { click, getButton, getByLabel, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

const district = { id: demoDistricts[0].id, code: 'HV-01', name: 'Saltmarsh Coast' };
const workerMe = {
  id: '00000000-0000-4000-8000-000000000103', email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker', districts: [district],
  preferences: { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' },
};
const storedFrom = (body: Record<string, unknown>) => ({
  housesVisited: null, containers: null, areaM2: null, product: null, amount: null, amountUnit: null, notes: null,
  ...body, district, submittedBy: { id: workerMe.id, name: workerMe.displayName }, submittedAt: '2026-03-10T10:00:00.000Z',
});
const noIndices = { house: null, container: null, breteau: null, pupa: null };

let view: Rendered | undefined;
beforeEach(() => localStorage.clear());
afterEach(() => {
  view?.unmount();
  view = undefined;
  vi.unstubAllGlobals();
});

/** The worker's Field log, with POST /api/field-records answering as `post` says (throwing = no connection). */
async function openFieldLog(post: (body: Record<string, unknown>) => Response) {
  const posted: Record<string, unknown>[] = [];
  fakeApi({
    'GET /api/me': () => json(200, workerMe),
    'GET /api/districts': () => json(200, { districts: [demoDistricts[0]] }),
    'GET /api/field-records': () => json(200, { records: [] }),
    'POST /api/field-records': (init) => {
      const body = JSON.parse(String(init.body)) as Record<string, unknown>;
      posted.push(body);
      return post(body);
    },
  });
  view = await renderRoutes('/field-log');
  const c = view.container;
  await waitFor(() => getByLabel(c, 'Locality'), 5000);
  await typeInto(getByLabel(c, 'Locality'), 'Harbour Row');
  return { c, posted };
}

describe('the Field log', () => {
  it('when a worker saves a record with the optional fields left empty, then the body carries null for them, never 0 or empty text', async () => {
    const { c, posted } = await openFieldLog((body) => json(201, storedFrom(body)));
    expect(c.textContent).toContain('Products are used only by trained staff, under their labels and local rules');
    await click(getButton(c, 'Save the record'));
    await waitFor(() => expect(c.textContent).toMatch(/Saved and sent/));
    expect(posted).toHaveLength(1);
    const body = posted[0];
    expect(body).toMatchObject({ districtId: district.id, locality: 'Harbour Row', kind: 'source-reduction' });
    for (const field of ['housesVisited', 'containers', 'areaM2', 'product', 'amount', 'amountUnit', 'notes']) expect(body[field]).toBeNull();
    expect(Object.values(body)).not.toContain(0);
    expect(Object.values(body)).not.toContain('');
    expect(localStorage.getItem(FIELD_RECORDS_OUTBOX_KEY)).toBe('[]');
  });

  it('when the worker is offline, then the record is kept on the device and listed as waiting', async () => {
    const { c } = await openFieldLog(() => {
      throw new TypeError('Failed to fetch');
    });
    await typeInto(getByLabel(c, 'Houses visited'), '40');
    await click(getButton(c, 'Save the record'));
    await waitFor(() => expect(c.textContent).toMatch(/Saved on this device/));
    const kept = JSON.parse(localStorage.getItem(FIELD_RECORDS_OUTBOX_KEY)!);
    expect(kept).toHaveLength(1);
    expect(kept[0]).toMatchObject({ survey: { locality: 'Harbour Row', housesVisited: 40, containers: null }, problem: { kind: 'offline' } });
    const waiting = c.querySelector('[data-testid="record-outbox"]')!;
    expect(waiting.textContent).toContain('Harbour Row');
    expect(waiting.textContent).toMatch(/no connection/);
  });

  it('when an amount is given without its unit, then the form names the unit and keeps nothing', async () => {
    const { c, posted } = await openFieldLog((body) => json(201, storedFrom(body)));
    await typeInto(getByLabel(c, 'Product'), 'Temephos 1% granules');
    await typeInto(getByLabel(c, 'Amount'), '250');
    await click(getButton(c, 'Save the record'));
    await waitFor(() => expect(c.textContent).toMatch(/Unit is required when an amount is given/));
    expect(posted).toHaveLength(0);
    expect(localStorage.getItem(FIELD_RECORDS_OUTBOX_KEY)).toBeNull();
  });
});

describe('the District file’s Field work panel', () => {
  it('when a side has fewer than 3 surveys, then the panel says "not compared" in words and shows the counts', async () => {
    const { demoDistrictFile } = await import('./support/board-fixtures');
    const file = demoDistrictFile();
    const base = storedFrom({ id: '11111111-1111-4111-8111-111111111111', districtId: file.district.id, locality: 'Harbour Row', date: '2025-03-10', kind: 'larviciding', housesVisited: 120 });
    fakeApi({
      'GET /api/me': () => json(200, officerMe),
      [`GET /api/districts/${file.district.id}/file`]: () => json(200, file),
      [`GET /api/districts/${file.district.id}/field-work`]: () =>
        json(200, {
          district: file.district,
          rule: { windowDays: 28, minSurveysPerSide: 3 },
          records: [
            { ...base, before: { surveys: 4, indices: { ...noIndices, house: 30, container: 12, breteau: 41 } }, after: { surveys: 2, indices: { ...noIndices, house: 10, container: 4, breteau: 12 } }, comparable: false },
          ],
        }),
    });
    view = await renderRoutes(`/districts/${file.district.id}`);
    const panel = await waitFor(() => {
      const p = view!.container.querySelector('[data-testid="field-work"]');
      expect(p?.textContent).toContain('larviciding');
      return p!;
    }, 8000);
    expect(panel.textContent).toContain('Not compared: fewer than 3 surveys on a side.');
    expect(panel.textContent).toContain('4 surveys');
    expect(panel.textContent).toContain('2 surveys');
    expect(panel.textContent).toContain('120 houses visited');
    expect(panel.textContent).toContain('does not say the work caused any change');
  });
});

describe('the records CSV', () => {
  it('when a record left its coverage empty, then its cells are empty, not 0', () => {
    const csv = fieldRecordsCsv(
      [storedFrom({ id: '11111111-1111-4111-8111-111111111111', districtId: district.id, locality: 'Harbour Row', date: '2026-03-10', kind: 'larviciding', housesVisited: 0 })] as never,
      { header: ['Date', 'Code', 'District', 'Locality', 'Kind', 'Houses', 'Containers', 'Area', 'Product', 'Amount', 'Unit', 'Notes', 'By'], kind: (k) => k },
    );
    expect(csv.split(/\r?\n/)[1]).toBe('2026-03-10,HV-01,Saltmarsh Coast,Harbour Row,larviciding,0,,,,,,,Wen Worker');
  });
});
