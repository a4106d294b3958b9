import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { i18n } from '../../src/i18n';
import { unitsFor, UnitsContext } from '../../src/lib/units';
import { formattersFor } from '../../src/i18n/format';
import { OUTBOX_KEY } from '../../src/features/surveys/offline-queue';
import { CorrectionForm } from '../../src/features/weather/components/correction.form';
import { issueReason, issueValue } from '../../src/features/weather/weather-units';
import { issuesCsvUrl } from '../../src/features/weather/api/issues.api';
import { OFFLINE_SESSION_KEY, rememberedSession, restoreOfflineSession, watchSession } from '../../src/pwa/offline-session';
import { ApiError } from '../../src/lib/api-client';
import { queryKeys } from '../../src/lib/query-keys';
import { demoDistricts, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, render, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

const districtId = demoDistricts[0].id;
const workerMe = {
  id: '00000000-0000-4000-8000-000000000103',
  email: 'worker@halvern.example',
  displayName: 'Wen Worker',
  role: 'worker',
  districts: [{ id: districtId, code: 'HV-01', name: 'Saltmarsh Coast' }],
};
const fahrenheitInches = unitsFor({ temperature: 'F', rain: 'in' });

let view: Rendered | undefined;
beforeEach(() => localStorage.clear());
afterEach(async () => {
  await i18n.changeLanguage('en');
});

describe('the survey screen in another language', () => {
  it('when the interface is French, then the form, its cross-field check and the outbox speak French and keep nothing on the device', async () => {
    // The signed-in layout applies the account's language (Settings).
    const frenchWorker = { ...workerMe, preferences: { language: 'fr', temperatureUnit: 'C', rainUnit: 'mm' } };
    fakeApi({
      'GET /api/me': () => json(200, frenchWorker),
      'GET /api/districts': () => json(200, { districts: [demoDistricts[0]] }),
      [`GET /api/districts/${districtId}/surveys`]: () => json(200, { district: workerMe.districts[0], surveys: [], weeks: [] }),
    });
    view = await renderRoutes('/surveys');
    const locality = await waitFor(() => getByLabel(view!.container, 'Localité'), 3000);
    await typeInto(locality, 'Rue du Port');
    await typeInto(getByLabel(view.container, 'Maisons inspectées'), '10');
    await typeInto(getByLabel(view.container, 'Maisons avec larves ou nymphes'), '12');
    await typeInto(getByLabel(view.container, 'Récipients contenant de l’eau inspectés'), '30');
    await typeInto(getByLabel(view.container, 'Récipients avec larves ou nymphes'), '12');
    expect(view.container.textContent).toContain('pneu');
    expect(view.container.textContent).toContain('En attente d’envoi');
    await click(getButton(view.container, 'Enregistrer l’enquête'));
    await waitFor(() => expect(view!.container.textContent).toContain('Il y a plus de maisons positives que de maisons inspectées.'));
    expect(view.container.textContent).not.toMatch(/positive houses exceed/i);
    expect(localStorage.getItem(OUTBOX_KEY)).toBeNull();
  });
});

describe('the one-day weather correction in the user’s units', () => {
  it('when the user works in °F and inches, then the labels say so and the day is sent in °C and mm', async () => {
    const sent: unknown[] = [];
    fakeApi({
      'PUT /api/weather/observations': (init) => {
        sent.push(JSON.parse(String(init.body)));
        return json(200, {
          id: '00000000-0000-4000-8000-000000000900', source: 'correction', fileName: null, status: 'done', tempUnit: 'C', rainUnit: 'mm',
          bytesTotal: 0, bytesProcessed: 0, rowsProcessed: 1, rowsAccepted: 1, rowsFlagged: 0, rowsRejected: 0, rowsReplaced: 1,
          issueCount: 0, message: null, createdAt: '2026-03-10T10:00:00.000Z', finishedAt: '2026-03-10T10:00:01.000Z',
        });
      },
    });
    view = await render(
      <QueryClientProvider client={new QueryClient()}>
        <UnitsContext value={fahrenheitInches}>
          <CorrectionForm from={{ rowNumber: 4, station: 'HV-S01', date: '2026-03-09', column: 'tmax', value: '212', severity: 'rejected', rule: 'temp-limits', reason: '' }} />
        </UnitsContext>
      </QueryClientProvider>,
    );
    await typeInto(getByLabel(view.container, 'Tmin (°F)'), '50');
    await typeInto(getByLabel(view.container, 'Tmax (°F)'), '68');
    await typeInto(getByLabel(view.container, 'Rain (in)'), '1');
    await click(getButton(view.container, 'Save the correction'));
    await waitFor(() => expect(view!.container.textContent).toContain('Saved. The earlier value is kept in the revisions.'));
    expect(sent).toEqual([{ station: 'HV-S01', date: '2026-03-09', tmin: 10, tmax: 20, rh: null, rain: 25.4, tempUnit: 'C', rainUnit: 'mm' }]);
  });

  it('when a temperature is not a number, then the field says so and nothing is sent', async () => {
    const fetchMock = fakeApi({});
    view = await render(
      <QueryClientProvider client={new QueryClient()}>
        <CorrectionForm from={null} />
      </QueryClientProvider>,
    );
    await typeInto(getByLabel(view.container, 'Station code'), 'HV-S01');
    await typeInto(getByLabel(view.container, 'Tmin (°C)'), 'warm');
    await click(getButton(view.container, 'Save the correction'));
    expect(view.container.textContent).toContain('Tmin (°C) must be a number.');
    expect(view.container.textContent).toContain('Date is required.');
    expect(fetchMock).not.toHaveBeenCalled();
  });
});

describe('row-report values and rules in the user’s units', () => {
  const f = formattersFor('en');
  const issue = { rowNumber: 3, station: 'HV-S01', date: '2026-03-01', column: 'tmax', severity: 'flagged' as const, rule: 'jump', reason: 'x' };

  it('when a flagged value (stored in °C) is shown to a °F user, then it is converted; a rejected value is read in the upload’s units', () => {
    expect(issueValue({ ...issue, value: '30' }, { tempUnit: 'C', rainUnit: 'mm' }, fahrenheitInches, f)).toBe('86 °F');
    expect(issueValue({ ...issue, severity: 'rejected', value: '212' }, { tempUnit: 'F', rainUnit: 'mm' }, unitsFor({ temperature: 'C', rain: 'mm' }), f)).toBe('100 °C');
    expect(issueValue({ ...issue, column: 'rain', severity: 'rejected', value: '2' }, { tempUnit: 'C', rainUnit: 'in' }, unitsFor({ temperature: 'C', rain: 'mm' }), f)).toBe('50.8 mm');
    expect(issueValue({ ...issue, severity: 'rejected', value: 'n/a' }, { tempUnit: 'C', rainUnit: 'mm' }, fahrenheitInches, f)).toBe('n/a');
  });

  it('when a limit rule is shown in French to a °F user, then the limits are in °F and in French numbers', () => {
    const t = i18n.getFixedT('fr', 'weather');
    const r = issueReason({ ...issue, rule: 'temp-limits', severity: 'rejected', value: '200', reason: 'Outside the physical limits of air temperature (-90 to 60 °C).' }, fahrenheitInches, formattersFor('fr'), t, 'fr');
    expect(r.text).toBe('Hors des limites physiques de la température de l’air (-130 °F à 140 °F).');
  });

  it('when the units are not SI, then the CSV link asks the server for them; with SI it stays as before', () => {
    expect(issuesCsvUrl('u1', fahrenheitInches)).toBe('/api/weather/uploads/u1/issues?format=csv&temperature=F&rain=in');
    expect(issuesCsvUrl('u1', unitsFor({ temperature: 'C', rain: 'mm' }))).toBe('/api/weather/uploads/u1/issues?format=csv');
  });
});

describe('the session remembered for opening offline', () => {
  it('when the server answered /api/me, then the user is remembered; offline the loader gets it back; sign-out forgets it', () => {
    const qc = new QueryClient();
    const stop = watchSession(qc);
    return qc.fetchQuery({ queryKey: queryKeys.me, queryFn: async () => workerMe }).then(() => {
      expect(rememberedSession()?.me.email).toBe('worker@halvern.example');
      const fresh = new QueryClient();
      vi.stubGlobal('navigator', { ...navigator, onLine: false });
      expect(restoreOfflineSession(fresh)).toBe(true);
      expect(fresh.getQueryData(queryKeys.me)).toMatchObject({ role: 'worker' });
      // A network failure (status 0) also falls back to it; a 401 does not.
      const other = new QueryClient();
      vi.stubGlobal('navigator', { ...navigator, onLine: true });
      expect(restoreOfflineSession(other, new ApiError(401, 'unauthorized', 'Sign in'))).toBe(false);
      expect(restoreOfflineSession(other, new ApiError(0, 'network_error', 'offline'))).toBe(true);
      qc.clear();
      expect(localStorage.getItem(OFFLINE_SESSION_KEY)).toBeNull();
      stop();
    });
  });

  it('when the server says 401 for /api/me, then the remembered user is forgotten', async () => {
    const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    const stop = watchSession(qc);
    await qc.fetchQuery({ queryKey: queryKeys.me, queryFn: async () => workerMe });
    expect(rememberedSession()).not.toBeNull();
    await qc
      .fetchQuery({ queryKey: queryKeys.me, queryFn: async () => Promise.reject(new ApiError(401, 'unauthorized', 'Sign in')), staleTime: 0 })
      .catch(() => undefined);
    expect(rememberedSession()).toBeNull();
    stop();
  });
});
