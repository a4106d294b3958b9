import { QueryClientProvider } from '@tanstack/react-query';
import { describe, expect, it, vi } from 'vitest';
import { districtOutlookResponse, type DistrictOutlookResponse } from '../../shared/api/outlook.schema';
import { queryClient } from '../../src/app/query-client';
import { CaseOutlookPanel } from '../../src/features/district-file/outlook/case-outlook.panel';
import { fakeApi, json } from './support/fake-api';
import { render, waitFor } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

const districtId = '00000000-0000-4000-8000-000000000001';
const dengue = { id: '00000000-0000-4000-8000-000000000201', name: 'Dengue' };

/** Monday of ISO week `week` of 2026 (week 1 starts 2025-12-29), as YYYY-MM-DD. */
const monday = (week: number) => new Date(Date.UTC(2025, 11, 29 + 7 * (week - 1))).toISOString().slice(0, 10);
const weekOf = (week: number) => ({ year: 2026, week, weekStart: monday(week), weekEnd: new Date(Date.UTC(2025, 11, 29 + 7 * (week - 1) + 6)).toISOString().slice(0, 10) });

const horizon = (h: number, beats: boolean) => ({
  horizon: h, scored: 120, logScore: -1.8 - h / 10, nullLogScore: -2.0, crps: 1.1 + h / 10, nullCrps: beats ? 1.6 : 1.2,
  crpsSkill: beats ? 0.2 : -0.05, logScoreGain: beats ? 0.15 : -0.02, coverage80: 0.82, coverage50: 0.53, beatsNull: beats,
});

/** An answer of the contract: `beats` says which weeks ahead (1–8) beat the null; the forecast covers 1…fanHorizons. */
function outlook(fanHorizons: number, beats: (h: number) => boolean, extra: Partial<DistrictOutlookResponse> = {}): DistrictOutlookResponse {
  return districtOutlookResponse.parse({
    districtId, disease: dengue, diseases: [dengue], status: 'ok',
    origin: { ...weekOf(30), cases: 7 },
    fanHorizons,
    forecast: Array.from({ length: fanHorizons }, (_, i) => ({ ...weekOf(31 + i), horizon: i + 1, mean: 8, q10: 3, q25: 5, q50: 8, q75: 11, q90: 15 + i })),
    recent: Array.from({ length: 16 }, (_, i) => ({ ...weekOf(14 + i), cases: i % 5 })),
    skill: { horizons: Array.from({ length: 8 }, (_, i) => horizon(i + 1, beats(i + 1))), origins: 300, firstOrigin: { year: 2020, week: 1 }, lastOrigin: { year: 2026, week: 22 } },
    model: { terms: ['intercept', 'sin', 'cos', 'ar'], coefficients: [0.1, 0.5, -0.3, 0.6], theta: 3.2, drivers: [], weeks: 400, profileId: null },
    computedAt: '2026-08-01T06:00:00.000Z',
    ...extra,
  });
}

async function show(answer: DistrictOutlookResponse | (() => Promise<Response>)) {
  const fetch = fakeApi({
    [`GET /api/districts/${districtId}/outlook`]: typeof answer === 'function' ? answer : () => json(200, answer),
  });
  const view = await render(
    <QueryClientProvider client={queryClient}>
      <CaseOutlookPanel districtId={districtId} />
    </QueryClientProvider>,
  );
  return { c: view.container, fetch };
}

const settled = (c: HTMLElement) => waitFor(() => expect(c.querySelector('[data-testid="outlook-why"]')).not.toBeNull(), 5000);
const text = (c: HTMLElement) => c.textContent ?? '';

describe('the Case outlook panel on the District file', () => {
  it('when the outlook beats the seasonal null for the first two weeks ahead, then the fan is drawn for those two weeks only, beside the skill of every week ahead, with the cautions', async () => {
    const { c, fetch } = await show(outlook(2, (h) => h <= 2 || h === 5));
    await settled(c);
    const stub = c.querySelector('[data-testid="outlook-fan"] [data-testid="echart-stub"]');
    expect(stub).not.toBeNull();
    expect(JSON.parse(stub!.getAttribute('data-series')!)).toEqual(['q10', 'Range 10–90 %', 'Range 25–75 %', 'Range 10–90 %', 'Most likely (median)', 'Cases seen']);
    // The top slice of the fan: q90 − q75 of 2 weeks ahead (16 − 11), nothing beyond it.
    expect(JSON.parse(stub!.getAttribute('data-largest')!)[3]).toBe(5);
    expect(text(c)).toContain('The fan covers the next 2 weeks');
    expect(text(c)).toContain('From 3 weeks ahead it did not');
    expect(text(c)).toContain('most likely 8 cases, 8 chances in 10 between 3 and 15');

    const rows = [...c.querySelectorAll('[data-testid="outlook-skill"] tbody tr')];
    expect(rows.map((r) => r.getAttribute('data-fan'))).toEqual(['yes', 'yes', 'no', 'no', 'no', 'no', 'no', 'no']);
    const cells = (r: Element) => [...r.querySelectorAll('th,td')].map((x) => x.textContent);
    // Week ahead, CRPS outlook / usual, closer by, log score outlook / usual, gain, 80 % coverage, scored, fan.
    expect(cells(rows[0]!)).toEqual(['1 week', '1.20 / 1.60', '+20%', '-1.90 / -2.00', '+0.15', '82%', '120', 'Yes']);
    expect(cells(rows[2]!)[2]).toBe('-5%');
    expect(rows[2]!.textContent).toContain('No: not better than the usual');
    // Week 5 ahead beat the null, but week 3 did not: the fan never skips a week.
    expect(rows[4]!.textContent).toContain('No: an earlier week ahead was not better');

    expect(text(c)).toContain('it is not a certainty');
    expect(text(c)).toContain('Decisions stay with the health authority');
    expect(new URL(String(fetch.mock.calls[0]![0]), 'http://localhost').search).toBe('');
  });

  it('when a skill rounds to zero, then it reads 0%, never -0%', async () => {
    const answer = outlook(0, () => false);
    answer.skill!.horizons[0]!.crpsSkill = -0.004;
    answer.skill!.horizons[0]!.logScoreGain = -0.001;
    const { c } = await show(answer);
    await settled(c);
    const first = c.querySelector('[data-testid="outlook-skill"] tbody tr')!;
    const cells = [...first.querySelectorAll('td')].map((x) => x.textContent);
    expect(cells[1]).toBe('0%');
    expect(cells[3]).toBe('0.00');
  });

  it('when fanHorizons is 0, then no fan is drawn and the panel says the outlook was not better than the seasonal usual', async () => {
    const { c } = await show(outlook(0, () => false));
    await settled(c);
    expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
    expect(c.querySelector('[data-testid="outlook-why"]')!.getAttribute('data-status')).toBe('no_skill');
    expect(text(c)).toContain('was not better than the seasonal usual at any week ahead, so no fan is drawn');
    expect([...c.querySelectorAll('[data-testid="outlook-skill"] tbody tr')].every((r) => r.getAttribute('data-fan') === 'no')).toBe(true);
    expect(text(c)).toContain('it is not a certainty');
  });

  it('when an answer carried forecasts beyond fanHorizons, then none of them is drawn', async () => {
    const withFan = outlook(3, () => true);
    const { c } = await show({ ...withFan, fanHorizons: 0 });
    await settled(c);
    expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
  });

  it('when next week is all on one count (an off-season week of nothing), then the summary names that count, not a range "between 0 and 0"', async () => {
    const answer = outlook(1, (h) => h === 1);
    answer.forecast = [{ ...answer.forecast[0]!, q10: 0, q25: 0, q50: 0, q75: 0, q90: 0, mean: 0.1 }];
    const { c } = await show(answer);
    await settled(c);
    expect(text(c)).toContain('0 cases, 8 chances in 10 or more');
    expect(text(c)).not.toContain('between 0 and 0');
  });

  it('when the district has too little data, then it says so in words, with no fan and no skill table', async () => {
    const { c } = await show(outlook(0, () => false, { status: 'too_little_data', skill: null, model: null, forecast: [] }));
    await settled(c);
    expect(c.querySelector('[data-testid="outlook-why"]')!.getAttribute('data-status')).toBe('too_little_data');
    expect(text(c)).toContain('Too little data for an outlook of Dengue: it needs at least two seasons (104 weeks) of weekly counts');
    expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
    expect(c.querySelector('[data-testid="outlook-skill"]')).toBeNull();
    expect(text(c)).toContain('Decisions stay with the health authority');
  });

  it('when the fit failed or there are no cases, then each is said in words and no fan is drawn', async () => {
    for (const status of ['failed', 'no_cases'] as const) {
      const { c } = await show(outlook(0, () => false, { status, skill: null, model: null }));
      await settled(c);
      expect(c.querySelector('[data-testid="outlook-why"]')!.getAttribute('data-status')).toBe(status);
      expect(text(c)).toContain(status === 'failed' ? 'could not be computed this time' : 'No weekly counts of Dengue are recorded');
      expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
      queryClient.clear();
    }
  });

  it('when the answer is still being computed, then the panel says so in words and draws nothing yet', async () => {
    const { c } = await show(() => new Promise<Response>(() => {}));
    await waitFor(() => expect(c.querySelector('[data-testid="outlook-loading"]')).not.toBeNull(), 5000);
    expect(text(c)).toContain('Computing the outlook');
    expect(c.querySelector('[data-testid="echart-stub"]')).toBeNull();
    expect(text(c)).toContain('it is not a certainty');
  });

  it('when the panel has not come near the viewport, then the outlook is not fetched', async () => {
    vi.stubGlobal('IntersectionObserver', class { observe() {} unobserve() {} disconnect() {} takeRecords() { return []; } });
    const { c, fetch } = await show(outlook(2, () => true));
    await new Promise((r) => setTimeout(r, 50));
    expect(fetch).not.toHaveBeenCalled();
    expect(text(c)).toContain('Computing the outlook');
  });
});
