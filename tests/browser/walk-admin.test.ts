import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';
import { WALK_TIMEOUT, walkAs } from '../support/walk';

/*
 * The admin's week: a new community worker invited (French, one district), a district renamed and its
 * population for the year recorded, the epidemic years of a district's channel changed (a setting admins
 * may change), their own display units changed, and the Season runs read. Broodcast has no audit screen
 * yet; the walk checks the audit rows the steps wrote. Fails on any 5xx answer or console error.
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

describe("the admin's week", () => {
  it('when the admin invites a user, edits a district, changes settings and reads the season runs, then every screen answers without a server or console error', async () => {
    const w = await walkAs(browser, server, 'admin', 'admin@halvern.example');
    const { page } = w;
    const auditCount = async () => Number((await server.ds.query(`SELECT count(*)::int AS n FROM audit_events`))[0].n);
    const auditBefore = await auditCount();

    // A new community worker for Orrin Ford, invited in French; the name's optional fields stay as given.
    await w.go('Users');
    const invite = page.locator('form[aria-labelledby="invite-title"]');
    await invite.getByLabel('E-mail').fill('lise.arnaud@halvern.example');
    await invite.getByLabel('Name').fill('Lise Arnaud');
    await invite.getByLabel('Role').selectOption({ label: 'Community worker' });
    await invite.getByLabel('Language').selectOption('fr');
    await invite.getByRole('checkbox', { name: /Orrin Ford/ }).check();
    await w.shot('invite');
    await invite.getByRole('button', { name: 'Send the invitation' }).click();
    await invite.getByText('Invitation sent to lise.arnaud@halvern.example.').waitFor();
    await page.getByRole('cell', { name: 'lise.arnaud@halvern.example' }).or(page.getByText('lise.arnaud@halvern.example').first()).first().waitFor();
    await w.shot('invited');
    expect((await server.ds.query(`SELECT role, language FROM users WHERE email = 'lise.arnaud@halvern.example'`))[0]).toEqual({ role: 'worker', language: 'fr' });

    // An epidemiologist gets one more district; their role stays what it was (the edit form's role select
    // must open on the user's role, not on the first in the list).
    const [epi] = await server.ds.query(`SELECT id, display_name AS name FROM users WHERE email = 'epi@halvern.example'`);
    await page.getByRole('button', { name: `Edit ${epi.name}` }).click();
    const userEditor = page.locator(`form[aria-labelledby="edit-${epi.id}"]`);
    expect(await userEditor.getByLabel('Role').inputValue()).toBe('epidemiologist');
    await userEditor.getByRole('checkbox', { name: /Lowmill/ }).check();
    await userEditor.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(async () => (await server.ds.query(
      `SELECT count(*)::int AS n FROM user_districts ud JOIN districts d ON d.id = ud.district_id WHERE ud.user_id = $1 AND d.name = 'Lowmill'`, [epi.id]))[0].n,
    { timeout: 15_000, message: await userEditor.innerText().catch(() => '') }).toBe(1);
    expect((await server.ds.query(`SELECT role FROM users WHERE id = $1`, [epi.id]))[0].role).toBe('epidemiologist');

    // Hestfield gets its full name and this year's population.
    await w.go('Districts');
    await page.getByRole('button', { name: 'Edit HV-07 Hestfield' }).click();
    const editor = page.locator('section', { has: page.getByRole('heading', { name: 'Edit HV-07 — Hestfield' }) });
    const rename = editor.locator('form', { has: page.getByRole('heading', { name: 'Code and name' }) });
    await rename.getByLabel('Name').fill('Hestfield Uplands');
    await rename.getByRole('button', { name: 'Save code and name' }).click();
    await page.getByText('Saved: HV-07 — Hestfield Uplands.').waitFor();
    const editorAfter = page.locator('section', { has: page.getByRole('heading', { name: 'Edit HV-07 — Hestfield Uplands' }) });
    const population = editorAfter.locator('form', { has: page.getByRole('heading', { name: 'Population for a year' }) });
    await population.getByLabel('Year').fill('2026');
    await population.getByLabel('Population').fill('93400');
    await population.getByRole('button', { name: 'Save the population' }).click();
    await population.getByText('Population for 2026 saved: 93,400.').waitFor();
    await w.shot('district-edited');
    expect((await server.ds.query(`SELECT name FROM districts WHERE code = 'HV-07'`))[0].name).toBe('Hestfield Uplands');

    // The dengue channel of Korrin Bay leaves out an epidemic season (from its District file's case page).
    await w.go('Ladder');
    await page.locator('.ladder-table tbody tr[data-district="HV-02"] th a').click();
    await page.getByRole('heading', { level: 1, name: 'Korrin Bay' }).waitFor();
    await page.getByRole('link', { name: 'Weekly case counts for this district' }).click();
    const years = page.locator('form[aria-labelledby="epidemic-years-title"]');
    await years.waitFor();
    // The checked seasons are the ones left out now; the admin also leaves out the first unchecked one.
    const boxes = years.getByRole('checkbox');
    await boxes.first().waitFor();
    const checked: number[] = [];
    let added = 0;
    for (let i = 0; i < (await boxes.count()); i++) {
      const box = boxes.nth(i);
      const year = Number((await box.locator('xpath=ancestor::label').innerText()).trim());
      if (await box.isChecked()) checked.push(year);
      else if (!added) added = year;
    }
    expect(added, 'a prior season not yet left out').toBeGreaterThan(0);
    await years.getByRole('checkbox', { name: String(added) }).check();
    await years.getByRole('button', { name: 'Save the epidemic years' }).click();
    const leftOut = [...checked, added].sort((a, b) => a - b);
    // The form says what was saved (it used to vanish as the page reloaded its data).
    await years.getByText(`Left out: ${leftOut.join(', ')}.`).waitFor();
    await w.shot('epidemic-years');
    const saved = await server.ds.query(
      `SELECT s.excluded_years FROM case_channel_settings s JOIN districts d ON d.id = s.district_id JOIN diseases x ON x.id = s.disease_id
        WHERE d.code = 'HV-02' AND x.code = 'DENV'`,
    );
    expect([...saved[0].excluded_years].sort((a: number, b: number) => a - b)).toEqual(leftOut);

    // Their own units: °F.
    await w.go('Settings');
    await page.getByLabel('Temperature unit').selectOption('F');
    await page.getByRole('button', { name: 'Save my settings' }).click();
    await page.getByText('Saved.').waitFor();
    await page.getByTestId('units-sample').getByText(/86(\.0)? °F/).waitFor();

    // The season runs: the one made at set-up is listed as finished.
    await w.go('Season runs');
    const runs = page.locator('table', { has: page.getByText('Season runs, newest first') });
    await runs.locator('tbody tr').first().waitFor();
    expect(await runs.locator('tbody tr').first().innerText()).toMatch(/finished/);
    await w.shot('season-runs');

    // Every change above is in the audit trail.
    expect(await auditCount()).toBeGreaterThanOrEqual(auditBefore + 4);

    await w.close();
    w.guard.assertClean();
  }, WALK_TIMEOUT);
});
