import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { queryClient } from '../../src/app/query-client';
import { OUTBOX_KEY, SurveyOutbox } from '../../src/features/surveys/offline-queue';
import { demoDistricts, fakeApi, json, officerMe } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

const districtId = demoDistricts[0].id;
const survey = (id: string) => ({
  id,
  districtId,
  locality: 'Harbour Row',
  date: '2026-03-10',
  housesInspected: 200,
  housesPositive: 30,
  containersInspected: 600,
  containersPositive: 45,
  pupae: null,
  containerTypes: [],
});
const stored = (id: string) => ({
  ...survey(id),
  district: { id: districtId, code: 'HV-01', name: 'Saltmarsh Coast' },
  year: 2026,
  week: 10,
  notes: null,
  submittedAt: '2026-03-10T10:00:00.000Z',
  indices: { house: 15, container: 7.5, breteau: 22.5, pupa: null },
});
const id1 = '11111111-1111-4111-8111-111111111111';
const id2 = '22222222-2222-4222-8222-222222222222';

beforeEach(() => localStorage.clear());
afterEach(() => vi.unstubAllGlobals());

describe('the survey outbox', () => {
  it('when a survey is saved offline, then it stays on the device and is sent with the same id once the connection is back', async () => {
    let online = false;
    const posted: string[] = [];
    const fetchFn = vi.fn(async (_url: unknown, init?: RequestInit) => {
      if (!online) throw new TypeError('Failed to fetch');
      const body = JSON.parse(String(init!.body));
      posted.push(body.id);
      return json(201, stored(body.id));
    });
    const outbox = new SurveyOutbox(localStorage, fetchFn as unknown as typeof fetch);
    outbox.add(survey(id1));
    const offline = await outbox.flush();
    expect(offline).toEqual({ sent: [], kept: 1 });
    expect(JSON.parse(localStorage.getItem(OUTBOX_KEY)!)[0]).toMatchObject({ survey: { id: id1 }, attempts: 1, problem: { kind: 'offline' } });

    // A reload reads the same storage: nothing is lost.
    const afterReload = new SurveyOutbox(localStorage, fetchFn as unknown as typeof fetch);
    expect(afterReload.items().map((i) => i.survey.id)).toEqual([id1]);
    online = true;
    const result = await afterReload.flush();
    expect(result.sent.map((s) => s.id)).toEqual([id1]);
    expect(result.kept).toBe(0);
    expect(posted).toEqual([id1]);
  });

  it('when the server already has the survey (200), then it leaves the outbox and is not kept twice', async () => {
    const fetchFn = vi.fn(async () => json(200, stored(id1)));
    const outbox = new SurveyOutbox(localStorage, fetchFn as unknown as typeof fetch);
    outbox.add(survey(id1));
    outbox.add(survey(id1));
    expect(outbox.items()).toHaveLength(1);
    expect((await outbox.flush()).kept).toBe(0);
    expect(fetchFn).toHaveBeenCalledTimes(1);
  });

  it('when the online event and a button press flush at once, then each survey is posted once', async () => {
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const fetchFn = vi.fn(async (_url: unknown, init?: RequestInit) => {
      await gate;
      return json(201, stored(JSON.parse(String(init!.body)).id));
    });
    const outbox = new SurveyOutbox(localStorage, fetchFn as unknown as typeof fetch);
    outbox.add(survey(id1));
    outbox.add(survey(id2));
    const a = outbox.flush();
    const b = outbox.flush();
    release();
    await Promise.all([a, b]);
    expect(fetchFn).toHaveBeenCalledTimes(2);
    expect(outbox.items()).toEqual([]);
  });

  it('when the server refuses a survey, then it stays with the reason for each field and the next one is still sent; discarding removes it', async () => {
    const fetchFn = vi.fn(async (_url: unknown, init?: RequestInit) => {
      const body = JSON.parse(String(init!.body));
      if (body.id === id1)
        return json(400, { error: { code: 'invalid_input', message: 'The body is not valid', fields: [{ path: 'housesPositive', message: 'positive houses exceed houses inspected' }] } });
      return json(201, stored(body.id));
    });
    const outbox = new SurveyOutbox(localStorage, fetchFn as unknown as typeof fetch);
    outbox.add(survey(id1));
    outbox.add(survey(id2));
    const result = await outbox.flush();
    expect(result.sent.map((s) => s.id)).toEqual([id2]);
    expect(outbox.items()).toMatchObject([{ survey: { id: id1 }, problem: { kind: 'refused', fields: [{ path: 'housesPositive' }] } }]);
    outbox.discard(id1);
    expect(outbox.items()).toEqual([]);
  });
});

describe('the survey form', () => {
  let view: Rendered | undefined;
  afterEach(() => {
    view?.unmount();
    view = undefined;
    queryClient.clear();
  });

  it('when more houses are positive than inspected, then the form names the field and keeps nothing on the device', async () => {
    const workerMe = { id: '00000000-0000-4000-8000-000000000103', email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker', districts: [{ id: districtId, code: 'HV-01', name: 'Saltmarsh Coast' }] };
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, workerMe),
      'GET /api/districts': () => json(200, { districts: [demoDistricts[0]] }),
      [`GET /api/districts/${districtId}/surveys`]: () => json(200, { district: workerMe.districts[0], surveys: [], weeks: [] }),
    });
    view = await renderRoutes('/surveys');
    const locality = await waitFor(() => getByLabel(view!.container, 'Locality'), 3000);
    await typeInto(locality, 'Harbour Row');
    await typeInto(getByLabel(view.container, 'Houses inspected'), '10');
    await typeInto(getByLabel(view.container, 'Houses with larvae or pupae'), '12');
    await typeInto(getByLabel(view.container, 'Water-holding containers inspected'), '30');
    await typeInto(getByLabel(view.container, 'Containers with larvae or pupae'), '12');
    await click(getButton(view.container, 'Save the survey'));
    await waitFor(() => expect(view!.container.textContent).toMatch(/Positive houses exceed houses inspected/));
    expect(localStorage.getItem(OUTBOX_KEY)).toBeNull();
    expect(fetchMock.mock.calls.some(([, init]) => (init as RequestInit | undefined)?.method === 'POST')).toBe(false);
  });

  it('when an officer chooses another district in the survey form, then the recent surveys beside it are that district’s', async () => {
    // Issue 21: the recent list ignored the chosen district.
    const [a, b] = demoDistricts;
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, officerMe),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      [`GET /api/districts/${a.id}/surveys`]: () => json(200, { district: { id: a.id, code: a.code, name: a.name }, surveys: [], weeks: [] }),
      [`GET /api/districts/${b.id}/surveys`]: () => json(200, { district: { id: b.id, code: b.code, name: b.name }, surveys: [], weeks: [] }),
    });
    view = await renderRoutes('/surveys');
    const c = view.container;
    await waitFor(() => expect(c.querySelector('#recent-title')?.textContent).toContain(a.name), 3000);
    await selectOption(getByLabel<HTMLSelectElement>(c, 'District'), b.id);
    await waitFor(() => expect(c.querySelector('#recent-title')?.textContent).toContain(b.name));
    expect(fetchMock.mock.calls.some(([url]) => String(url).includes(`/api/districts/${b.id}/surveys`))).toBe(true);
  });
});
