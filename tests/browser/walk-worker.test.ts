import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';
import { signedInAgent } from '../support/factories';
import { PHONE, walkAs, type Walker } from '../support/walk';

/*
 * The community worker's week on a phone (360 × 740, touch): their own district, the advisory for it, a
 * larval survey sent online with the pupae count left empty, one filled offline and sent once the phone
 * is back online, then their District file with the surveys counted. One step per test, on one page, so a
 * failing step is named; the last test fails on any 5xx answer or console error seen on the way.
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;
let w: Walker;

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
  // An advisory for the worker's district: the supervisor approves the season run's flag for Saltmere.
  const supervisor = await signedInAgent(server.app, 'supervisor@halvern.example', DEMO_PASSWORD);
  const flag = (await supervisor.get('/api/flags')).body.flags.find((f: { districtName: string; status: string }) => f.districtName === 'Saltmere' && f.status === 'open');
  expect(flag, 'an open flag for Saltmere after the season run').toBeTruthy();
  expect((await supervisor.post(`/api/flags/${flag.id}/approve`).send({ version: flag.version })).status).toBe(200);
});
afterAll(async () => {
  await w?.close();
  await stop?.();
});

const surveys = async (locality: string) =>
  (await server.ds.query(`SELECT pupae FROM larval_surveys WHERE locality = $1`, [locality])) as { pupae: number | null }[];
/** Whether the element is inside the phone's screen now (not only somewhere on the page). */
const onScreen = (locator: import('playwright-core').Locator) =>
  locator.evaluate((el) => {
    const r = el.getBoundingClientRect();
    return r.bottom > 0 && r.top < window.innerHeight;
  });
const scrollWidth = () => w.page.evaluate(() => Math.max(document.documentElement.scrollWidth, document.body.scrollWidth));

describe("the community worker's week on a phone", () => {
  it('when the worker signs in on the phone, then the first screen shows their own district only', async () => {
    w = await walkAs(browser, server, 'worker', 'worker@halvern.example', PHONE);
    await w.page.locator('main').getByText('Saltmere').first().waitFor();
    expect(await w.page.locator('main').getByText('Korrin Bay').count()).toBe(0);
    await w.shot('home');
  });

  it('when the worker opens the advisories, then the one for Saltmere is there with its caution', async () => {
    await w.go('Advisories');
    const list = w.page.getByTestId('advisories');
    await list.getByRole('heading', { name: 'Saltmere (HV-01)' }).waitFor();
    expect(await list.locator('li', { hasText: 'Saltmere (HV-01)' }).first().innerText()).toMatch(/estimate/i);
    expect(await scrollWidth()).toBeLessThanOrEqual(360);
    await w.shot('advisory');
  });

  it('when the worker sends a survey online with the pupae count left empty, then it is stored without pupae', async () => {
    const { page } = w;
    await w.go('Surveys');
    await page.getByLabel('Locality').fill('Saltmere Old Market');
    await page.getByLabel('Houses inspected').fill('32');
    await page.getByLabel('Houses with larvae or pupae').fill('4');
    await page.getByLabel('Water-holding containers inspected').fill('85');
    await page.getByLabel('Containers with larvae or pupae').fill('6');
    await page.getByLabel('tyre').check();
    await page.getByLabel('bucket or jar').check();
    await page.getByRole('button', { name: 'Save the survey' }).click();
    await page.getByText('Survey of Saltmere Old Market sent.').waitFor();
    // The confirmation is on the screen where the worker is, not above the long form.
    expect(await onScreen(page.getByText('Survey of Saltmere Old Market sent.'))).toBe(true);
    await w.shot('survey-sent');
    expect(await surveys('Saltmere Old Market')).toEqual([{ pupae: null }]);
  });

  it('when the phone is offline, then a survey is kept on the phone and reaches the server once, back online', async () => {
    const { page } = w;
    await w.guard.offline(async () => {
      await page.getByLabel('Locality').fill('Saltmere Ferry Lane');
      await page.getByLabel('Houses inspected').fill('18');
      await page.getByLabel('Houses with larvae or pupae').fill('2');
      await page.getByLabel('Water-holding containers inspected').fill('40');
      await page.getByLabel('Containers with larvae or pupae').fill('3');
      await page.getByLabel('Pupae counted').fill('11');
      await page.getByRole('button', { name: 'Save the survey' }).click();
      await page.getByText(/Survey of Saltmere Ferry Lane saved on this device/).waitFor();
      expect(await onScreen(page.getByText(/Survey of Saltmere Ferry Lane saved on this device/))).toBe(true);
      await page.getByTestId('survey-outbox').getByText('Saltmere Ferry Lane').waitFor();
      await w.shot('survey-offline');
      expect(await surveys('Saltmere Ferry Lane')).toEqual([]);
    });
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor({ timeout: 15_000 });
    expect(await surveys('Saltmere Ferry Lane')).toEqual([{ pupae: 11 }]);
    // A reload sends nothing again.
    await page.reload();
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor();
    expect(await surveys('Saltmere Ferry Lane')).toHaveLength(1);
    expect(await scrollWidth()).toBeLessThanOrEqual(360);
    await w.shot('survey-arrived');
  });

  it("when the worker opens their District file after the week's surveys, then it draws", async () => {
    const { page } = w;
    await w.go('Ladder', /./);
    await page.locator('main').getByRole('link', { name: 'Saltmere' }).first().click();
    await page.getByRole('heading', { level: 1, name: 'Saltmere' }).waitFor();
    await page.locator('figure[data-chart] [data-testid="chart-box"] canvas').first().waitFor();
    await w.shot('district-file');
  });

  it('when the week is walked, then no answer was a 5xx and the browser logged no error', () => {
    w.guard.assertClean();
  });
});
