import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { queryClient } from '../../src/app/query-client';
import { demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, type Rendered, renderRoutes, waitFor } from './support/render';

const districtId = demoDistricts[0].id;
const surveyId = '00000000-0000-4000-8000-000000000901';
const workerMe = {
  id: '00000000-0000-4000-8000-000000000103', email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker',
  districts: [{ id: districtId, code: 'HV-01', name: 'Saltmarsh Coast' }],
};
const survey = (voided: { at: string; by: string | null; reason: string } | null) => ({
  id: surveyId, district: workerMe.districts[0], locality: 'Harbour Row', date: '2026-11-25', year: 2026, week: 47,
  housesInspected: 100, housesPositive: 40, containersInspected: 300, containersPositive: 90, pupae: null, containerTypes: [],
  notes: null, submittedAt: '2026-11-25T10:00:00.000Z', indices: { house: 40, container: 30, breteau: 90, pupa: null }, voided,
});

async function typeInTextArea(el: HTMLTextAreaElement, value: string) {
  await act(async () => {
    Object.getOwnPropertyDescriptor(HTMLTextAreaElement.prototype, 'value')!.set!.call(el, value);
    el.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
  queryClient.clear();
});

describe('voiding a survey', () => {
  it('when a worker voids a survey, then the dialog asks for a reason first, sends it, and the list shows the survey voided with its reason', async () => {
    let voided = false;
    const fetchMock = fakeApi({
      'GET /api/me': () => json(200, workerMe),
      'GET /api/districts': () => json(200, { districts: [demoDistricts[0]] }),
      [`GET /api/districts/${districtId}/surveys`]: () =>
        json(200, {
          district: workerMe.districts[0],
          surveys: [survey(voided ? { at: '2026-11-26T09:00:00.000Z', by: workerMe.id, reason: 'Wrong ward' } : null)],
          weeks: voided ? [] : [{ year: 2026, week: 47, surveys: 1, pupaSurveys: 0, houses: 100, indices: { house: 40, container: 30, breteau: 90, pupa: null } }],
        }),
      [`POST /api/surveys/${surveyId}/void`]: () => {
        voided = true;
        return json(200, survey({ at: '2026-11-26T09:00:00.000Z', by: workerMe.id, reason: 'Wrong ward' }));
      },
    });
    view = await renderRoutes('/surveys');
    const c = view.container;
    await waitFor(() => getButton(c, 'Void'), 3000);
    await click(getButton(c, 'Void'));
    expect(c.querySelector('[role="dialog"]')?.textContent).toContain('Void the survey of Harbour Row');
    // No reason: the field says so and nothing is sent.
    await click(getButton(c, 'Void it'));
    await waitFor(() => expect(c.querySelector('.field-error')?.textContent).toMatch(/Why is it voided\?.*required/));
    expect(fetchMock.mock.calls.some(([, init]) => (init as RequestInit | undefined)?.method === 'POST')).toBe(false);

    await typeInTextArea(getByLabel<HTMLTextAreaElement>(c, 'Why is it voided?'), 'Wrong ward');
    await click(getButton(c, 'Void it'));
    const post = fetchMock.mock.calls.find(([, init]) => (init as RequestInit | undefined)?.method === 'POST');
    expect(JSON.parse(String((post![1] as RequestInit).body))).toEqual({ reason: 'Wrong ward' });
    await waitFor(() => expect(c.textContent).toContain('Voided: Wrong ward. It counts in no index.'), 3000);
    expect(c.querySelector('[role="dialog"]')).toBeNull();
  });
});
