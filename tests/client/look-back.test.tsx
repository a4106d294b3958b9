import { afterEach, describe, expect, it, vi } from 'vitest';
import { i18n } from '../../src/i18n';
import type { LeadSkillDto, LookBackRunDto } from '../../shared/api/look-back.schema';
import { adminMe, fakeApi, json, officerMe } from './support/fake-api';
import { waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));

// Each test has its own run id, so the query cache of one test never answers another.
let RUN_ID = '7d3c1f7e-5b8a-4c44-9a55-2f2f6f0f1a01';
const run = (over: Partial<LookBackRunDto> = {}): LookBackRunDto => ({
  id: RUN_ID, fromYear: 2023, toYear: 2025, status: 'succeeded', districtsTotal: 12, districtsDone: 12, weeksWritten: 1900,
  districtsFailed: 0, byPerson: true, startedAt: '2026-11-30T08:00:00.000Z', finishedAt: '2026-11-30T08:04:00.000Z', warnings: [], error: null, ...over,
});
const scores = (hit: number | null) => {
  const table = { hits: 3, falseAlarms: 1, misses: 1, correctNegatives: 95 };
  const interval = { estimate: hit, lower: 0.5, upper: 0.9, replicates: 300 };
  const model = (h: number | null) => ({ table, hitRate: h, falseAlarmRatio: 0.25, falseAlarmRate: 0.01, auc: 0.8, brier: 0.04, hitRateInterval: interval, falseAlarmRatioInterval: interval, aucInterval: interval, falseAlarmRateInterval: interval });
  const leads: LeadSkillDto[] = Array.from({ length: 12 }, (_, i) => ({ lead: i + 1, pairs: 100, tier: model(hit), climatology: model(0.33), persistence: model(0.5), channel: model(0.4) }));
  return { runId: RUN_ID, warnAt: 'high', event: { method: 'geometric', line: 'upper' }, groups: [{ level: 'overall', id: null, name: null, districts: 12, leads, leadTimes: [2, 3, 4] }] };
};

let view: Rendered | undefined;
afterEach(async () => {
  await i18n.changeLanguage('en');
});

async function open(me: typeof adminMe, handlers: Parameters<typeof fakeApi>[0], title = 'Look-back') {
  fakeApi({ 'GET /api/me': () => json(200, me), ...handlers });
  view = await renderRoutes('/look-back');
  await waitFor(() => expect(view!.container.querySelector('h1')?.textContent).toBe(title), 5000);
  return view.container;
}

describe('the Look-back screen', () => {
  it('when a Look-back has finished, then a supervisor sees hit rate and false-alarm ratio by lead time beside the null models, with the cautions, and no start form', async () => {
    const c = await open({ ...officerMe, role: 'supervisor' }, {
      'GET /api/look-back/runs': () => json(200, { runs: [run()] }),
      [`GET /api/look-back/runs/${RUN_ID}`]: () => json(200, run()),
      [`GET /api/look-back/runs/${RUN_ID}/scores`]: () => json(200, scores(0.75)),
    });
    await waitFor(() => expect(c.textContent).toContain('Hit rate by lead time'));
    expect(c.textContent).toContain('False-alarm ratio by lead time');
    expect(c.textContent).toContain('1 week ahead: replayed tier 75%, same week in other seasons 33%, last week repeated 50%');
    expect(c.textContent).toContain('3 event onsets had an unbroken warning before them; the median lead was 3 weeks.');
    expect(c.textContent).toContain('Decisions stay with the health authority');
    expect(c.textContent).not.toContain('Start the Look-back');
  });

  it('when a Look-back is running, then an admin sees its progress and the districts it could not replay, named with the reason in words', async () => {
    RUN_ID = '7d3c1f7e-5b8a-4c44-9a55-2f2f6f0f1a02';
    const running = run({
      status: 'running', districtsDone: 3, finishedAt: null, districtsFailed: 1,
      warnings: [{ code: 'district_failed', districtId: 'd1', districtName: 'Pellam Highlands', params: { stage: 'replay' }, reason: { code: 'invalid_value', params: { fields: 'pupae' } } }],
    });
    const c = await open(adminMe, {
      'GET /api/look-back/runs': () => json(200, { runs: [running] }),
      [`GET /api/look-back/runs/${RUN_ID}`]: () => json(200, running),
    });
    const bar = await waitFor(() => {
      const b = c.querySelector('[role="progressbar"]');
      if (!b) throw new Error('no progress bar');
      return b;
    });
    expect(bar.getAttribute('aria-valuenow')).toBe('3');
    expect(c.textContent).toContain('3 of 12 districts (25%)');
    expect(c.textContent).toContain('1 district could not be replayed');
    expect(c.textContent).toContain('Pellam Highlands:');
    expect(c.textContent).not.toContain('invalid_value');
    expect(c.textContent).toContain('Start the Look-back');
  });

  it('when the language is French, then the screen is in French with a narrow no-break space before the colon', async () => {
    await i18n.changeLanguage('fr');
    RUN_ID = '7d3c1f7e-5b8a-4c44-9a55-2f2f6f0f1a03';
    const frenchOfficer = { ...officerMe, preferences: { ...officerMe.preferences, language: 'fr' } };
    const c = await open(frenchOfficer, {
      'GET /api/look-back/runs': () => json(200, { runs: [run()] }),
      [`GET /api/look-back/runs/${RUN_ID}`]: () => json(200, run()),
      [`GET /api/look-back/runs/${RUN_ID}/scores`]: () => json(200, scores(null)),
    }, 'Rétrospective');
    await waitFor(() => expect(c.textContent).toContain('Taux de détection selon l’avance'));
    expect(c.textContent).toContain('Aucun événement dans ces saisons\u202f: le taux de détection ne peut pas être calculé.');
  });
});
