import { describe, expect, it } from 'vitest';
import { queryClient } from '../../src/app/query-client';
import { i18n } from '../../src/i18n';
import { seasonRun } from './support/board-fixtures';
import { adminMe, fakeApi, json } from './support/fake-api';
import { click, getButton, waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;
async function open(handlers: Parameters<typeof fakeApi>[0]) {
  const fetch = fakeApi({ 'GET /api/me': () => json(200, adminMe), ...handlers });
  const opened = await renderRoutes('/season-runs');
  view = opened;
  const router = opened.router;
  await waitFor(() => expect(view!.container.querySelector('h1')?.textContent).toBe('Season runs'), 5000);
  return { c: view.container, fetch };
}

describe('season runs', () => {
  it('when a run is in progress, then the progress bar shows districts done of the total', async () => {
    const running = seasonRun();
    const { c } = await open({
      'GET /api/season-runs': () => json(200, { runs: [running] }),
      [`GET /api/season-runs/${running.id}`]: () => json(200, running),
    });
    const bar = await waitFor(() => {
      const b = c.querySelector('[role="progressbar"]');
      if (!b) throw new Error('no progress bar');
      return b;
    });
    expect(bar.getAttribute('aria-valuenow')).toBe('3');
    expect(bar.getAttribute('aria-valuemax')).toBe('12');
    expect(c.textContent).toContain('3 of 12 districts (25%)');
    expect(getButton(c, 'Run the season now').disabled).toBe(true);
  });

  it('when the run is started while another runs, then the 409 message is shown', async () => {
    const done = seasonRun({ status: 'succeeded', districtsDone: 12, finishedAt: '2025-06-02T08:05:00.000Z', warnings: [{ code: 'no_weather', message: 'Pellam Highlands has no weather.' }] }); // a run stored before warnings were codes
    const { c } = await open({
      'GET /api/season-runs': () => json(200, { runs: [done] }),
      'POST /api/season-runs': () => json(409, { error: { code: 'run_in_progress', message: 'Wait for it to finish.' } }),
    });
    await waitFor(() => expect(c.textContent).toContain('1 warning'));
    expect(c.textContent).toContain('Pellam Highlands has no weather.');
    await click(getButton(c, 'Run the season now'));
    await waitFor(() => expect(c.querySelector('[role="alert"]')?.textContent).toBe('A season run is already in progress. Wait for it to finish.'));
  });

  it('when a run left one district out, then the screen counts "11 / 12", names the district and says why in words (no code, no JSON), in English and French', async () => {
    const done = seasonRun({
      status: 'succeeded', districtsDone: 11, districtsFailed: 1, finishedAt: '2025-06-02T08:05:00.000Z',
      warnings: [
        { code: 'district_failed', districtId: 'd1', districtName: 'Pellam Highlands', params: { stage: 'compute' }, reason: { code: 'invalid_value', params: { fields: 'pupae' } } },
        { code: 'missing_weather', districtId: 'd2', districtName: 'Vell Marsh' },
        { code: 'weather_held', params: { count: 20, stations: 'HV-UP-07' } },
      ],
    });
    const { c } = await open({ 'GET /api/season-runs': () => json(200, { runs: [done] }) });
    await waitFor(() => expect(c.textContent).toContain('3 warnings'));
    expect(c.textContent).toContain('11 / 12');
    expect(c.textContent).toContain('1 failed: Pellam Highlands');
    expect(c.textContent).toContain('Pellam Highlands was not computed: a stored value is not valid (pupae).');
    expect(c.textContent).toContain('Vell Marsh: no weather this season.');
    // Issue 16: held weather is named in words on the run.
    expect(c.textContent).toContain('20 station-days held as implausible (stations HV-UP-07) were left out of this run');
    expect(c.textContent).not.toMatch(/district_failed|invalid_value|missing_weather|weather_held|\{"/);
    try {
      await i18n.changeLanguage('fr');
      await waitFor(() => expect(c.textContent).toContain('Pellam Highlands n’a pas été calculé\u202f: une valeur enregistrée n’est pas valide (pupae).'));
      expect(c.textContent).toContain('1 en échec\u202f: Pellam Highlands');
    } finally {
      await i18n.changeLanguage('en');
    }
  });

  it('when a run raised more warnings than it keeps, then the summary counts them all and the list ends with "N more not listed", in English and French', async () => {
    const done = seasonRun({
      status: 'succeeded', districtsDone: 12, finishedAt: '2025-06-02T08:05:00.000Z', warningsNotListed: 1234,
      warnings: [{ code: 'missing_weather', districtId: 'd2', districtName: 'Vell Marsh' }, { code: 'no_position', districtId: 'd3', districtName: 'Tarrow Fen' }],
    });
    const { c } = await open({ 'GET /api/season-runs': () => json(200, { runs: [done] }) });
    await waitFor(() => expect(c.textContent).toContain('1,236 warnings'));
    expect(c.querySelector('[data-testid="warnings-not-listed"]')?.textContent).toBe('1,234 more warnings not listed (a run keeps at most 2)');
    try {
      await i18n.changeLanguage('fr');
      await waitFor(() => expect(c.querySelector('[data-testid="warnings-not-listed"]')?.textContent).toBe('1\u202f234 autres avertissements non listés (un calcul en conserve au plus 2)'));
    } finally {
      await i18n.changeLanguage('en');
    }
  });

  it('when a run is started, then its progress is polled until it finishes and the board is refreshed', async () => {
    let polls = 0;
    const started = seasonRun({ districtsDone: 0 });
    const { c, fetch } = await open({
      'GET /api/season-runs': () => json(200, { runs: [] }),
      'POST /api/season-runs': () => json(202, started),
      [`GET /api/season-runs/${started.id}`]: () => {
        polls++;
        return json(200, polls < 2 ? { ...started, districtsDone: 6 } : { ...started, status: 'succeeded', districtsDone: 12, finishedAt: '2025-06-02T08:05:00.000Z' });
      },
    });
    await waitFor(() => expect(c.textContent).toContain('No season run yet.'));
    queryClient.setQueryData(['board'], { rows: [] });
    queryClient.setQueryData(['districts', 'x', 'file', null], {});
    await click(getButton(c, 'Run the season now'));
    const sent = fetch.mock.calls.find(([, init]) => (init as RequestInit | undefined)?.method === 'POST');
    expect(JSON.parse(String((sent![1] as RequestInit).body))).toEqual({ full: false });
    await waitFor(() => expect(c.textContent).toContain('Season run finished'), 5000);
    expect(c.querySelector('[role="progressbar"]')?.getAttribute('aria-valuenow')).toBe('12');
    await waitFor(() => expect(queryClient.getQueryState(['districts', 'x', 'file', null])?.isInvalidated).toBe(true));
    expect(queryClient.getQueryState(['board'])?.isInvalidated).toBe(true);
  });

  it('when runs were started by a person and by Broodcast itself (at start-up), then only the first reads "by hand"', async () => {
    // Issue 21: the runs made at start-up were labelled "by hand".
    const byHand = seasonRun({ id: '00000000-0000-4000-8000-000000000071', status: 'succeeded', districtsDone: 12, finishedAt: '2025-06-02T08:05:00.000Z', byPerson: true });
    const atStart = seasonRun({ id: '00000000-0000-4000-8000-000000000072', status: 'succeeded', districtsDone: 12, finishedAt: '2025-06-01T02:05:00.000Z', byPerson: false });
    const { c } = await open({ 'GET /api/season-runs': () => json(200, { runs: [byHand, atStart] }) });
    await waitFor(() => expect(c.querySelectorAll('tbody tr').length).toBeGreaterThanOrEqual(2));
    const rows = [...c.querySelectorAll('tbody tr')].map((r) => r.textContent ?? '');
    expect(rows.filter((r) => r.includes('by hand'))).toHaveLength(1);
    expect(rows.filter((r) => r.includes('started by Broodcast'))).toHaveLength(1);
  });
});
