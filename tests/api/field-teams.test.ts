import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let t: TestApp;
let base: { id: string };
let officer: Agent;
let supervisor: Agent;
let member: { id: string; email: string };
let memberAgent: Agent;
let outsiderAgent: Agent;
let epidemiologist: { id: string };

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  base = await makeDistrict(t.ds);
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
  member = await makeUser(t.ds, { role: 'worker', districtIds: [base.id] });
  memberAgent = await signedInAgent(t.app, member.email);
  outsiderAgent = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [base.id] })).email);
  epidemiologist = await makeUser(t.ds, { role: 'epidemiologist' });
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, 'field_teams', 'field_team_members', 'audit_events');
const team = (over: Record<string, unknown> = {}) => ({
  name: `Team ${randomUUID().slice(0, 8)}`, baseDistrictId: base.id, memberIds: [member.id], kinds: ['larviciding', 'source-reduction'], daysPerWeek: 4, ...over,
});

describe('field teams', () => {
  it('when the officer adds a team, then it is listed with its base, members, training and days, and audited; renaming it and deleting it work too', async () => {
    const before = await rows();
    const created = await officer.post('/api/field-teams').send(team({ name: 'Harbour larviciding' }));
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: 'Harbour larviciding', baseDistrict: { id: base.id }, kinds: ['larviciding', 'source-reduction'], daysPerWeek: 4 });
    expect(created.body.members.map((m: { id: string }) => m.id)).toEqual([member.id]);
    expect(await rows()).toEqual({ field_teams: before.field_teams + 1, field_team_members: before.field_team_members + 1, audit_events: before.audit_events + 1 });

    const listed = await supervisor.get('/api/field-teams');
    expect(listed.body.teams.map((x: { id: string }) => x.id)).toContain(created.body.id);

    const updated = await officer.put(`/api/field-teams/${created.body.id}`).send(team({ name: 'Harbour team', memberIds: [], daysPerWeek: 5 }));
    expect(updated.status).toBe(200);
    expect(updated.body).toMatchObject({ name: 'Harbour team', members: [], daysPerWeek: 5 });

    expect((await officer.delete(`/api/field-teams/${created.body.id}`)).status).toBe(204);
    expect((await officer.delete(`/api/field-teams/${created.body.id}`)).status).toBe(404);
  });

  it('when the officer asks who may be on a team, then active officers and community workers are listed, nobody else', async () => {
    const people = (await officer.get('/api/field-teams/candidates')).body.people as { id: string; role: string }[];
    expect(people.map((x) => x.id)).toContain(member.id);
    expect(people.map((x) => x.id)).not.toContain(epidemiologist.id);
    expect(new Set(people.map((x) => x.role))).toEqual(new Set(['officer', 'worker']));
  });

  it('when a community worker lists teams, then they see only the teams they are on', async () => {
    const mine = await officer.post('/api/field-teams').send(team());
    const notMine = await officer.post('/api/field-teams').send(team({ memberIds: [] }));
    const seen = (await memberAgent.get('/api/field-teams')).body.teams.map((x: { id: string }) => x.id);
    expect(seen).toContain(mine.body.id);
    expect(seen).not.toContain(notMine.body.id);
    expect((await outsiderAgent.get('/api/field-teams')).body.teams).toEqual([]);
  });

  it('when a team has an unknown base, a member who is not an officer or worker, no training, a repeated member, too many days or a taken name, then it is refused naming the field and nothing is written', async () => {
    const taken = (await officer.post('/api/field-teams').send(team())).body.name;
    const before = await rows();
    const cases: [Record<string, unknown>, number, string][] = [
      [{ baseDistrictId: randomUUID() }, 400, 'baseDistrictId'],
      [{ memberIds: [epidemiologist.id] }, 400, 'memberIds.0'],
      [{ memberIds: [randomUUID()] }, 400, 'memberIds.0'],
      [{ memberIds: [member.id, member.id] }, 400, 'memberIds'],
      [{ kinds: [] }, 400, 'kinds'],
      [{ kinds: ['fogging-by-drone'] }, 400, 'kinds.0'],
      [{ daysPerWeek: 8 }, 400, 'daysPerWeek'],
      [{ daysPerWeek: 2.5 }, 400, 'daysPerWeek'],
      [{ name: ' ' }, 400, 'name'],
      [{ name: taken }, 409, 'name'],
    ];
    for (const [over, status, field] of cases) {
      const res = await officer.post('/api/field-teams').send(team(over));
      expect(res.status, JSON.stringify(over)).toBe(status);
      expect(res.body.error.fields.map((f: { path: string }) => f.path), JSON.stringify(over)).toContain(field);
    }
    expect(await rows()).toEqual(before);
  });
});
