import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';
import { WALK_TIMEOUT, walkAs } from '../support/walk';

/*
 * The epidemiologist's week, through the Case ledger: counts typed into the grid and into the form (the
 * confirmed / probable split given once, left empty otherwise), a file of counts uploaded, a count
 * corrected with a reason and its history read, and last week closed. Fails on any 5xx answer or console
 * error.
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

describe("the epidemiologist's week", () => {
  it('when the epidemiologist enters, uploads, corrects and closes counts with the split left empty, then every screen answers without a server or console error', async () => {
    const w = await walkAs(browser, server, 'epidemiologist', 'epi@halvern.example');
    const { page } = w;
    const countOf = async (code: string, disease: string, year: number, week: number) =>
      (
        await server.ds.query(
          `SELECT c.cases, c.confirmed, c.probable, c.version FROM case_counts c JOIN districts d ON d.id = c.district_id
             JOIN diseases s ON s.id = c.disease_id WHERE d.code = $1 AND s.code = $2 AND c.epi_year = $3 AND c.epi_week = $4`,
          [code, disease, year, week],
        )
      )[0] as { cases: number; confirmed: number | null; probable: number | null; version: number } | undefined;

    await w.go('Case ledger');
    const grid = page.locator('table.case-grid');
    await grid.waitFor();
    // The grid's newest column is this week (nothing reported yet); the one before it is last week.
    const weeks = (await grid.locator('thead th').allInnerTexts()).map((s) => s.trim().split('\n')[0]!.trim()).filter((s) => /^W\d+ \d{4}$/.test(s)); // an open week's header also says "reporting open"
    const [lastWeek, thisWeek] = weeks.slice(-2);
    const [cw, cy] = thisWeek.slice(1).split(' ').map(Number);
    await w.shot('ledger');

    // A count typed into the grid (Dengue, Korrin Bay, this week): no split.
    const cell = (code: string, week: string) => grid.getByRole('textbox', { name: new RegExp(`^Cases ${code} ${week}\\b`) });
    const saved = page.waitForResponse((r) => r.request().method() === 'PUT' && /\/api\/districts\/[^/]+\/cases$/.test(new URL(r.url()).pathname) && r.status() < 300);
    await cell('HV-02', thisWeek).fill('7');
    await cell('HV-02', thisWeek).press('Enter');
    await saved;
    await expect.poll(() => countOf('HV-02', 'DENV', cy, cw)).toMatchObject({ cases: 7, confirmed: null, probable: null });

    // Two counts through the form: Vessmouth with only the confirmed part, Saltmere with no split at all.
    const form = page.locator('form[aria-labelledby="entry-title"]');
    await form.getByLabel('District').selectOption({ label: 'HV-03 — Vessmouth' });
    await form.getByLabel('Disease').selectOption({ label: 'Dengue' });
    await form.getByLabel('Cases').fill('12');
    await form.getByLabel('Confirmed (optional)').fill('5');
    await form.getByRole('button', { name: 'Save the count' }).click();
    await form.getByText(`Saved HV-03 week ${cw} of ${cy}: 12 cases.`).waitFor();
    await form.getByLabel('District').selectOption({ label: 'HV-01 — Saltmere' });
    await form.getByLabel('Cases').fill('31');
    await form.getByLabel('Confirmed (optional)').fill('');
    await form.getByRole('button', { name: 'Save the count' }).click();
    await form.getByText(`Saved HV-01 week ${cw} of ${cy}: 31 cases.`).waitFor();
    await w.shot('entered');
    expect(await countOf('HV-03', 'DENV', cy, cw)).toMatchObject({ cases: 12, confirmed: 5, probable: null });
    expect(await countOf('HV-01', 'DENV', cy, cw)).toMatchObject({ cases: 31, confirmed: null, probable: null });

    // The valley districts' malaria counts, from the clinics' file.
    const upload = page.locator('form[aria-labelledby="upload-title"]');
    const csv = ['district,year,week,disease,cases', `HV-04,${cy},${cw},MAL-PV,3`, `HV-05,${cy},${cw},MAL-PV,0`, `HV-06,${cy},${cw},MAL-PF,1`].join('\n');
    await upload.getByLabel('CSV file').setInputFiles({ name: 'clinics-week.csv', mimeType: 'text/csv', buffer: Buffer.from(csv + '\n') });
    await upload.getByRole('button', { name: 'Upload the file' }).click();
    await upload.getByText('clinics-week.csv: 3 rows read — 3 new, 0 corrected, 0 unchanged.').waitFor();
    await w.shot('uploaded');
    expect(await countOf('HV-05', 'MAL-PV', cy, cw)).toMatchObject({ cases: 0 });

    // Korrin Bay's 7 was a typing slip: corrected to 9 with the reason, then its history read.
    await cell('HV-02', thisWeek).fill('9');
    await cell('HV-02', thisWeek).press('Enter');
    const panel = page.locator('section[aria-labelledby="cell-panel-title"]');
    await panel.getByText('Correct 7 to 9').waitFor();
    await panel.getByLabel('Reason for the correction').fill('Clinic re-sent its tally: two cases were missed');
    await panel.getByRole('button', { name: 'Save the correction' }).click();
    // The panel closes on saving; the confirmation stays under the grid (it used to vanish with the panel).
    await page.getByText('Saved: 9 cases.').waitFor();
    await w.shot('corrected');
    await expect.poll(() => countOf('HV-02', 'DENV', cy, cw)).toMatchObject({ cases: 9, version: 2 });
    await expect.poll(() => cell('HV-02', thisWeek).inputValue()).toBe('9');
    await cell('HV-02', thisWeek).focus();
    await panel.getByRole('button', { name: 'Show the revision history' }).click();
    const history = panel.getByTestId('revision-history');
    await history.getByRole('cell', { name: 'Clinic re-sent its tally: two cases were missed' }).waitFor();
    expect(await history.locator('tbody tr').count()).toBe(2);
    await w.shot('history');

    // Last week is complete for Korrin Bay: closed.
    await cell('HV-02', lastWeek).focus();
    await panel.getByRole('button', { name: `Close ${lastWeek} for HV-02` }).click();
    // Closing asks first.
    await panel.getByRole('button', { name: 'Yes, close the week' }).click();
    await panel.getByText(`${lastWeek} is closed for Korrin Bay.`).waitFor();
    await w.shot('week-closed');
    const [ly, lw] = [Number(lastWeek.split(' ')[1]), Number(lastWeek.slice(1).split(' ')[0])];
    const closures = await server.ds.query(
      `SELECT count(*)::int AS n FROM case_week_closures c JOIN districts d ON d.id = c.district_id WHERE d.code = 'HV-02' AND c.epi_year = $1 AND c.epi_week = $2`,
      [ly, lw],
    );
    expect(closures[0].n).toBe(1);

    await w.close();
    w.guard.assertClean();
  }, WALK_TIMEOUT);
});
