import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { setLanguage } from '../../src/i18n';
import { AXIS_LIMITS, TEMPERATURE_RECORD_C, withinAxis } from '../../src/features/district-file/charts/axis-limits';
import { demoDistrictFile } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { click, getButton, type Rendered, renderRoutes, waitFor } from './support/render';
import en from '../../src/i18n/locales/en/district-file.json';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));

/*
 * Axis limits from the science (src/features/district-file/charts/axis-limits.ts):
 * - temperature within the records ever measured at a surface station, 56.7 °C (Furnace Creek, 1913) and
 *   −89.2 °C (Vostok, 1983): WMO World Weather and Climate Extremes Archive (World Meteorological
 *   Organization, 2023);
 * - an EIP at most a season (EIP_MAX_DAYS = 365, shared/model/traits.ts; common practice of this product);
 * - degree-days at most 366 × 56.7 °C·d (derived from the temperature record).
 */

let view: Rendered | undefined;
afterEach(async () => {
  view?.unmount();
  view = undefined;
  await act(() => setLanguage('en'));
  vi.restoreAllMocks();
});

/** The demo file with a 10¹⁹-day EIP on day 5 and a 60 °C afternoon on day 7 planted in it. */
function plantedFile() {
  const file = demoDistrictFile();
  file.vectorClock[0].eipDays[4] = 3.068e19;
  file.weather.tmax[6] = 60;
  file.vectorClock[0].cumulativeDegreeDays[8] = 1e7;
  return file;
}

async function open(url: string, file = plantedFile()) {
  fakeApi({
    'GET /api/me': () => json(200, officerMe),
    [`GET /api/districts/${file.district.id}/file`]: () => json(200, file),
  });
  view = await renderRoutes(url);
  const c = view.container;
  await waitFor(() => expect(c.querySelector('h1')?.textContent ?? '').toContain('Saltmarsh Coast'), 15_000);
  return c;
}

const figure = (c: HTMLElement, title: string) => {
  const f = [...c.querySelectorAll('figure[data-chart]')].find((x) => x.getAttribute('data-chart')!.startsWith(title));
  if (!f) throw new Error(`no chart ${title}`);
  return f as HTMLElement;
};
/** The largest value the chart's series number `i` would draw. */
const largest = (f: HTMLElement, i = 0) => JSON.parse(f.querySelector('[data-testid="echart-stub"]')!.getAttribute('data-largest')!)[i] as number;

describe('chart axes clamped to plausible ranges', () => {
  it('when a value lies beyond its range, then it is left out of the drawing and counted', () => {
    expect(withinAxis([1, null, 1e19, -5, Infinity, 300], AXIS_LIMITS.eipDays)).toEqual({ values: [1, null, null, null, null, 300], beyond: 3 });
    expect(withinAxis([56.7, 60, -89.2, -95], TEMPERATURE_RECORD_C)).toEqual({ values: [56.7, null, -89.2, null], beyond: 2 });
  }, 20_000);

  it('when the District file holds a 10¹⁹-day EIP and a 60 °C day, then the vector clock, heat and weather axes stay plausible and each chart says how many values lie beyond', async () => {
    const c = await open('/districts/' + plantedFile().district.id);
    await waitFor(() => expect(c.querySelectorAll('figure[data-chart]').length).toBeGreaterThan(3), 5000);

    const eip = figure(c, 'Vector clock');
    expect(largest(eip)).toBeLessThanOrEqual(AXIS_LIMITS.eipDays.max);
    expect(eip.querySelector('[data-beyond-axis]')?.textContent).toBe('1 value beyond the axis, not drawn.');

    const weather = figure(c, 'Daily temperature');
    expect(largest(weather, 0)).toBeLessThan(57); // the day's maximum
    expect(weather.querySelector('[data-beyond-axis]')?.textContent).toBe('1 value beyond the axis, not drawn.');
    // The summary's warmest day is a plausible one, not the 60 °C day.
    expect(weather.textContent).not.toContain('60.0');

    const heat = figure(c, 'Heat accumulation');
    expect(largest(heat)).toBeLessThanOrEqual(AXIS_LIMITS.degreeDaysC.max);
    expect(heat.querySelector('[data-beyond-axis]')?.getAttribute('data-beyond-axis')).toBe('1');

    // A chart with nothing beyond says nothing.
    expect(figure(c, 'Relative vectorial capacity').querySelector('[data-beyond-axis]')).toBeNull();
  }, 20_000);

  it('when the language is French, Spanish or Portuguese, then the note is in that language with its plural', async () => {
    const file = plantedFile();
    file.weather.tmax[8] = 61;
    const c = await open('/districts/' + file.district.id, file);
    const said: Record<string, string | null | undefined> = {};
    for (const lang of ['fr', 'es', 'pt'] as const) {
      await act(() => setLanguage(lang));
      await waitFor(() => expect(c.querySelector('figure[data-chart] [data-beyond-axis="2"]')).not.toBeNull(), 5000);
      said[lang] = c.querySelector('[data-beyond-axis="2"]')?.textContent;
    }
    expect(said).toEqual({
      fr: '2 valeurs au-delà de l’axe, non tracées.',
      es: '2 valores fuera del eje, sin dibujar.',
      pt: '2 valores além do eixo, não desenhados.',
    });
  }, 20_000);

  it('when the EIP is longer than a season, then its key number and its table say "not completed" instead of the number', async () => {
    const file = plantedFile();
    file.vectorClock[0].eipDays[19] = 3.068e16;
    const c = await open('/districts/' + file.district.id, file);
    await waitFor(() => expect(c.querySelector('[data-key-number="eip"]')).not.toBeNull(), 5000);
    const notCompleted = en.eip.notCompleted;
    expect(c.querySelector('[data-key-number="eip"]')?.textContent).toContain(notCompleted);
    const eip = figure(c, 'Vector clock');
    await click(getButton(eip, 'Show as table'));
    await waitFor(() => expect(eip.querySelector('table')).not.toBeNull(), 5000);
    const cells = [...eip.querySelectorAll('tbody tr')].map((r) => r.children[1]?.textContent ?? '');
    expect(cells.at(-1)).toBe(notCompleted);
    expect(cells.some((x) => /\d{7}/.test(x.replace(/[\s,.\u202f\u00a0]/g, '')))).toBe(false);
  }, 20_000);

  it('when the printable page draws the heat chart, then the line stays within the season and the note says what lies beyond', async () => {
    const file = plantedFile();
    fakeApi({ 'GET /api/me': () => json(200, officerMe), [`GET /api/districts/${file.district.id}/file`]: () => json(200, file) });
    view = await renderRoutes(`/districts/${file.district.id}/print`);
    const c = view.container;
    // The printable page comes in lazily; after the screens above it is polled without act (act's loop kept it waiting here).
    for (const start = Date.now(); !c.querySelector('#print-heat'); ) {
      if (Date.now() - start > 15_000) throw new Error('the printable page did not open');
      await new Promise((r) => setTimeout(r, 50));
    }
    const section = c.querySelector('#print-heat')!.closest('section')!;
    expect(section.querySelector('[data-beyond-axis]')?.textContent).toBe('1 value beyond the axis, not drawn.');
    const ys = [...section.querySelectorAll('polyline')].flatMap((p) => p.getAttribute('points')!.split(' ').map((xy) => Number(xy.split(',')[1])));
    // Every point lies inside the drawing (220 px high), none shot off above its top.
    expect(Math.min(...ys)).toBeGreaterThanOrEqual(0);
  }, 20_000);
});
