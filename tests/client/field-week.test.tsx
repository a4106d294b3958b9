import { describe, expect, it } from 'vitest';
import { fakeApi, json, officerMe } from './support/fake-api';
import { demoDistricts } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, renderRoutes } from './support/render';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const DAYS = ['2026-12-07', '2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11'];
const week = (over: Record<string, unknown> = {}) => ({
  id: id(900), weekStart: DAYS[0], workingDays: DAYS, status: 'draft', edited: false, publishedAt: null,
  ladderWeek: { year: 2026, week: 48 }, maxTravelKm: 150, visitWeight: 1, coveredRisk: 150000, ladderOrderRisk: 80000, totalRisk: 210000,
  teams: [{ id: id(10), name: 'Harbour team', baseDistrict: { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast' }, kinds: ['larviciding'], daysPerWeek: 2 }],
  days: [{ teamId: id(10), districtId: id(1), day: DAYS[0] }],
  districts: [
    { districtId: id(1), code: 'HV-01', name: 'Saltmarsh Coast', rank: 1, tier: 'high', risk: 80000, daysNeeded: 2, daysProposed: 1, workNeeded: ['larviciding'], reason: { code: 'partly_planned', params: { days: 1, needed: 2, teams: ['Harbour team'] } } },
    { districtId: id(2), code: 'HV-02', name: 'Orrin Valley', rank: 2, tier: 'raised', risk: 60000, daysNeeded: 1, daysProposed: 0, workNeeded: ['case-investigation'], reason: { code: 'no_trained_team', params: { kinds: ['case-investigation', 'space-spraying'] } } },
  ],
  ...over,
});

describe('Field week screen', () => {
  it('when the officer opens the week, picks another district for a day, saves and publishes, then the edit is sent and the plan says it was published and mailed', async () => {
    let saved: unknown = null;
    const fetch = fakeApi({
      'GET /api/me': () => json(200, officerMe),
      'GET /api/field-weeks': () => json(200, { week: week() }),
      'GET /api/field-teams': () => json(200, { teams: [] }),
      [`PUT /api/field-weeks/${id(900)}/days`]: (init) => {
        saved = JSON.parse(String(init.body));
        return json(200, week({ edited: true, days: (saved as { days: unknown[] }).days }));
      },
      [`POST /api/field-weeks/${id(900)}/publish`]: () => json(200, week({ status: 'published', publishedAt: '2026-12-05T09:00:00.000Z', mailed: 3 })),
    });
    const { container: c } = await renderRoutes('/field-week');
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe('Field week'), 5000);
    await waitFor(() => expect(c.textContent).toContain('Risk covered by the proposal: 150,000 of 210,000'));
    expect(c.textContent).toContain('taking the top districts of the Ladder team by team: 80,000');
    expect(c.textContent).toContain('Out: no team is trained for the work it needs (case investigation, space spraying).');
    expect(c.textContent).toContain('every district weighs the same');
    expect(c.textContent).toContain('trained staff only');

    const select = c.querySelector<HTMLSelectElement>(`select[id$="${id(10)}-${DAYS[1]}"]`)!;
    await selectOption(select, id(2));
    expect(getButton(c, 'Publish to the teams').disabled).toBe(true); // save first
    await click(getButton(c, 'Save changes'));
    await waitFor(() => expect(saved).not.toBeNull());
    expect((saved as { days: unknown[] }).days).toEqual([
      { teamId: id(10), districtId: id(1), day: DAYS[0] },
      { teamId: id(10), districtId: id(2), day: DAYS[1] },
    ]);
    await waitFor(() => expect(getButton(c, 'Publish to the teams').disabled).toBe(false));
    await click(getButton(c, 'Publish to the teams'));
    await waitFor(() => expect(c.textContent).toContain('3 team members were sent their days.'));
    expect(fetch).toHaveBeenCalled();
  });

  it('when the officer adds a team with a name already taken, then the name field says so; with a new name, the team is added', async () => {
    let sent: Record<string, unknown> | null = null;
    let taken = true;
    fakeApi({
      'GET /api/me': () => json(200, officerMe),
      'GET /api/field-weeks': () => json(200, { week: null }),
      'GET /api/field-teams': () => json(200, { teams: [] }),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
      'GET /api/field-teams/candidates': () => json(200, { people: [{ id: id(102), displayName: 'Wen Worker', role: 'worker' }] }),
      'POST /api/field-teams': (init) => {
        sent = JSON.parse(String(init.body));
        if (taken) return json(409, { error: { code: 'team_name_taken', message: 'Another team already has this name.', fields: [{ path: 'name', message: 'is taken by another team' }] } });
        return json(201, { id: id(11), name: sent!.name, baseDistrict: { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast' }, members: [], kinds: ['larviciding'], daysPerWeek: 4, updatedAt: '2026-12-05T09:00:00.000Z' });
      },
    });
    const { container: c } = await renderRoutes('/field-week');
    await waitFor(() => expect(c.textContent).toContain('No plan for this week yet.'), 5000);
    await typeInto(getByLabel(c, 'Team name'), 'Harbour team');
    // The base and the members are the shared search pickers: a short list shows whole, as checkboxes.
    await waitFor(() => getByLabel(c, 'Saltmarsh Coast · HV-01'));
    await click(getByLabel(c, 'Saltmarsh Coast · HV-01'));
    await click(getByLabel(c, 'larviciding'));
    await click(getByLabel(c, 'Wen Worker · Community worker'));
    expect((getByLabel(c, 'Wen Worker · Community worker') as HTMLInputElement).checked).toBe(true);
    await click(getButton(c, 'Add the team'));
    await waitFor(() => expect(c.textContent).toContain('is taken by another team'));
    expect(sent).toEqual({ name: 'Harbour team', baseDistrictId: id(1), kinds: ['larviciding'], daysPerWeek: 4, memberIds: [id(102)] });
    taken = false;
    await click(getButton(c, 'Add the team'));
    await waitFor(() => expect(c.textContent).toContain('Team Harbour team added.'));
  });
});

describe('Field week for a team member', () => {
  it('when a community worker opens the published week, then they read the days of their team and the work needed, with nothing to plan or edit', async () => {
    fakeApi({
      'GET /api/me': () => json(200, { ...officerMe, role: 'worker', email: 'worker@halvern.example' }),
      'GET /api/field-weeks': () => json(200, { week: week({ status: 'published', publishedAt: '2026-12-05T09:00:00.000Z' }) }),
    });
    const { container: c } = await renderRoutes('/field-week');
    await waitFor(() => expect(c.textContent).toContain('Saltmarsh Coast (larviciding)'), 5000);
    expect(c.textContent).toContain("The week's plan for your teams");
    expect(c.textContent).toContain('trained staff only');
    expect(c.querySelector('select')).toBeNull();
    expect([...c.querySelectorAll('button')].map((b) => b.textContent)).not.toContain('Propose the week');
    expect([...c.querySelectorAll('button')].map((b) => b.textContent)).not.toContain('Publish to the teams');
  });
});

describe('Field week CSV', () => {
  it('when the plan is written as CSV, then there is one row per team and day with the district, its tier and the work needed, in the words given', async () => {
    const { fieldWeekCsv } = await import('../../src/features/field-week/field-week.csv');
    const csv = fieldWeekCsv(week({ days: [{ teamId: id(10), districtId: id(2), day: DAYS[1] }, { teamId: id(10), districtId: id(1), day: DAYS[0] }] }) as never, {
      header: ['Day', 'Team', 'Code', 'District', 'Tier', 'Work'],
      tier: (x) => (x === 'high' ? 'High' : String(x)),
      kind: (k) => k.replace(/-/g, ' '),
    });
    const lines = csv.trim().split(/\r?\n/);
    expect(lines[0]).toBe('Day,Team,Code,District,Tier,Work');
    expect(lines[1]).toBe('2026-12-07,Harbour team,HV-01,Saltmarsh Coast,High,larviciding');
    expect(lines[2]).toBe('2026-12-08,Harbour team,HV-02,Orrin Valley,raised,case investigation');
  });
});

describe('Field week for a supervisor', () => {
  it('when a week waits for approval and the supervisor sends it back without a reason, then the reason field says so; approving publishes it', async () => {
    let approved = false;
    fakeApi({
      'GET /api/me': () => json(200, { ...officerMe, role: 'supervisor', email: 'supervisor@halvern.example' }),
      'GET /api/field-weeks': () => json(200, { week: week({ status: 'awaiting_approval', submittedAt: '2026-12-05T09:00:00.000Z', submittedBy: 'Olu Officer' }) }),
      'POST /api/field-weeks/00000000-0000-4000-8000-000000000900/send-back': () => json(400, { error: { code: 'validation_failed', message: 'Invalid request.', fields: [{ path: 'reason', message: 'must say why (3 characters or more)' }] } }),
      'POST /api/field-weeks/00000000-0000-4000-8000-000000000900/approve': () => {
        approved = true;
        return json(200, week({ status: 'published', publishedAt: '2026-12-05T10:00:00.000Z', mailed: 1, review: { decision: 'approved', by: 'Sam Supervisor', at: '2026-12-05T10:00:00.000Z', reason: null } }));
      },
    });
    const { container: c } = await renderRoutes('/field-week');
    await waitFor(() => expect(c.textContent).toContain("Waiting for a supervisor’s approval"), 5000);
    await click(getButton(c, 'Send back to the health officer'));
    await waitFor(() => expect(c.textContent).toContain('must say why'));
    await click(getButton(c, 'Approve and send to the teams'));
    await waitFor(() => expect(c.textContent).toContain('Published'));
    expect(approved).toBe(true);
  });
});
