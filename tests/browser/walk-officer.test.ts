import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';
import { WALK_TIMEOUT, walkAs } from '../support/walk';

/*
 * The health officer's week, through the screens: the Ladder, a District file, a weather file uploaded
 * (rh and rain left empty on some rows, one row refused and then corrected by hand, a second file in °F),
 * a season run started by hand, and a flag raised by hand. Fails on any 5xx answer or console error.
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

/** A day `n` days before today (UTC), as YYYY-MM-DD: recent, so the stations are active and it is not in the future. */
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

describe("the health officer's week", () => {
  it('when the officer reads the Ladder, uploads and corrects weather, runs the season and raises a flag, then every screen answers without a server or console error', async () => {
    const w = await walkAs(browser, server, 'officer', 'officer@halvern.example');
    const { page } = w;
    const count = async (sql: string, params: unknown[] = []) => Number((await server.ds.query(sql, params))[0].n);

    // Monday: the Ladder, then the District file of the district ranked first.
    await page.getByRole('heading', { level: 1, name: 'Ladder' }).waitFor();
    const rows = page.locator('.ladder-table tbody tr[data-district]');
    await rows.first().waitFor();
    expect(await rows.count()).toBe(12);
    await page.locator('[data-testid="region-map"] canvas').first().waitFor();
    await w.shot('ladder');
    const top = rows.first().locator('th a');
    const topName = (await top.innerText()).trim();
    await top.click();
    await page.getByRole('heading', { level: 1, name: topName }).waitFor();
    await page.locator('figure[data-chart] [data-testid="chart-box"] canvas').first().waitFor();
    await w.shot('district-file');

    // Tuesday: the week's station weather. rh and rain are left empty on some rows (they are optional);
    // one row has Tmin above Tmax and is refused.
    const d1 = daysAgo(9);
    const d2 = daysAgo(8);
    const csv = [
      'station,date,tmin,tmax,rh,rain',
      `HVS-01,${d1},24.1,31.2,80,0`,
      `HVS-01,${d2},24.3,31.8,,`,
      `HVS-02,${d1},23.9,30.9,,4.2`,
      `HVS-02,${d2},31.5,29.8,77,`,
      `HVS-03,${d1},22.8,30.4,74,1.6`,
    ].join('\n');
    await w.go('Intake');
    await page.getByLabel('Weather file (CSV)').setInputFiles({ name: 'week-stations.csv', mimeType: 'text/csv', buffer: Buffer.from(csv + '\n') });
    await page.getByLabel('Temperatures in').selectOption('C');
    await page.getByRole('button', { name: 'Upload and check' }).click();
    const result = page.locator('section[aria-labelledby="result-title"]');
    await result.getByRole('heading', { name: 'week-stations.csv — loaded' }).waitFor();
    // The row report names the refused row and its reason.
    const refused = result.locator('tr', { hasText: /Tmin \(31\.5\) is above Tmax/  });
    await refused.waitFor();
    expect(await refused.innerText()).toContain('HVS-02');
    await w.shot('row-report');

    // The refused day, corrected by hand (rh and rain left empty).
    await refused.getByRole('button', { name: 'Correct' }).click();
    const fix = result.getByRole('form', { name: 'Correct one day' });
    expect(await fix.getByLabel('Station code').inputValue()).toBe('HVS-02');
    expect(await fix.getByLabel('Date').inputValue()).toBe(d2);
    await fix.getByLabel('Tmin (°C)').fill('23.6');
    await fix.getByLabel('Tmax (°C)').fill('30.2');
    await fix.getByRole('button', { name: 'Save the correction' }).click();
    await fix.getByText(/^Saved\./).waitFor();
    await w.shot('row-corrected');

    // A station that writes °F: one row, the file's unit chosen in the form; stored in °C.
    const d3 = daysAgo(7);
    await page.getByLabel('Weather file (CSV)').setInputFiles({
      name: 'fahrenheit-station.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(`station,date,tmin,tmax,rh,rain\nHVS-04,${d3},75.2,88.7,,\n`),
    });
    await page.getByLabel('Temperatures in').selectOption('F');
    await page.getByRole('button', { name: 'Upload and check' }).click();
    await result.getByRole('heading', { name: 'fahrenheit-station.csv — loaded' }).waitFor();
    const day = await page.evaluate(async (date) => {
      const { stations } = await (await fetch('/api/weather/stations')).json();
      const station = stations.find((s: { code: string }) => s.code === 'HVS-04');
      const { days } = await (await fetch(`/api/weather/stations/${station.id}/days?from=${date}&to=${date}`)).json();
      return days[0];
    }, d3);
    expect(day.tmin).toBeCloseTo(24, 1);
    expect(day.tmax).toBeCloseTo(31.5, 1);
    expect(day.rh ?? null).toBeNull();
    await w.shot('fahrenheit-upload');

    // Wednesday: the season, run now after the uploads.
    await w.go('Season runs');
    await page.getByRole('button', { name: 'Run the season now' }).click();
    await page.getByText('Season run finished').waitFor({ timeout: 30_000 });
    await page.getByText('The Ladder and every District file now show the new results.').waitFor();
    await w.shot('season-run');
    expect(await count(`SELECT count(*)::int AS n FROM season_runs WHERE status = 'succeeded'`)).toBeGreaterThanOrEqual(2);

    // Thursday: a flag raised by hand for a district the season run does not see trouble in; the
    // proposed message is left empty (Broodcast writes one).
    await w.go('Advisories');
    await page.getByRole('link', { name: 'Raise a flag' }).click();
    await page.getByRole('heading', { level: 1, name: 'Raise a flag' }).waitFor();
    await page.getByLabel('District', { exact: true }).selectOption({ label: 'Lowmill (HV-06)' });
    await page.getByLabel('What did you see?').fill('A cluster of fevers reported by the Lowmill market clinic this week.');
    await w.shot('raise-flag');
    await page.getByRole('button', { name: 'Raise the flag' }).click();
    await page.waitForURL(/\/flags\/[0-9a-f-]{36}$/);
    await page.getByRole('cell', { name: 'A cluster of fevers reported by the Lowmill market clinic this week.' }).waitFor();
    await w.shot('flag-raised');
    expect(await count(`SELECT count(*)::int AS n FROM flags WHERE source = 'manual' AND status = 'open'`)).toBe(1);

    await w.close();
    w.guard.assertClean();
  }, WALK_TIMEOUT);
});
