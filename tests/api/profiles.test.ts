import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, randomId, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let officer: Awaited<ReturnType<typeof signedInAgent>>;
let adminId: string;
const TABLES = ['district_profiles', 'audit_events', 'profile_variants'];
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  const a = await makeUser(t.ds, { role: 'admin' });
  adminId = a.id;
  admin = await signedInAgent(t.app, a.email);
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
});
afterAll(() => t.close());

describe('the profile library', () => {
  it('when a signed-in officer reads the profiles, then every published profile comes with each parameter, its values and source', async () => {
    const res = await officer.get('/api/profiles');
    expect(res.status).toBe(200);
    const aegypti = res.body.profiles.find((p: { id: string }) => p.id === 'aedes-aegypti-dengue');
    expect(aegypti.kind).toBe('published');
    const lower = aegypti.parameters.find((p: { path: string }) => p.path === 'development.lowerThreshold');
    expect(typeof lower.value).toBe('number');
    expect(lower.unit).toBeTruthy();
    for (const p of aegypti.parameters) if (p.tag !== 'common practice') expect(p.source?.author).toBeTruthy();
    expect(aegypti.parameters.some((p: { low: number | null; high: number | null }) => p.low !== null || p.high !== null)).toBe(true);
  });
});

describe('assigning profiles to districts', () => {
  it('when an officer assigns profiles, then the answer is 403 and nothing is written', async () => {
    const d = await makeDistrict(t.ds);
    const before = await countRows(t.ds, ...TABLES);
    const res = await officer.put('/api/districts/profiles').send({ districtIds: [d.id], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up' });
    expect(res.status).toBe(403);
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  const bad: [string, (id: string) => object, string, string][] = [
    ['an unknown profile', (id) => ({ districtIds: [id], profiles: [{ profileId: 'no-such-profile', biofix: null }], reason: 'set-up' }), 'unknown_profile', 'profiles.0.profileId'],
    ['an impossible biofix 02-30', (id) => ({ districtIds: [id], profiles: [{ profileId: 'culex-wnv', biofix: '02-30' }], reason: 'set-up' }), 'invalid_input', 'profiles.0.biofix'],
    ['a biofix month 13', (id) => ({ districtIds: [id], profiles: [{ profileId: 'culex-wnv', biofix: '13-01' }], reason: 'set-up' }), 'invalid_input', 'profiles.0.biofix'],
    ['a district listed twice', (id) => ({ districtIds: [id, id], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up' }), 'invalid_input', 'districtIds'],
    ['a profile listed twice', (id) => ({ districtIds: [id], profiles: [{ profileId: 'culex-wnv', biofix: null }, { profileId: 'culex-wnv', biofix: '04-01' }], reason: 'set-up' }), 'invalid_input', 'profiles'],
    ['no districts and no regions', () => ({ profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up' }), 'invalid_input', 'districtIds'],
    ['no reason', (id) => ({ districtIds: [id], profiles: [{ profileId: 'culex-wnv', biofix: null }] }), 'invalid_input', 'reason'],
    ['an unknown field', (id) => ({ districtIds: [id], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up', extra: 1 }), 'invalid_input', 'extra'],
    ['a district that does not exist', () => ({ districtIds: [randomId()], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up' }), 'unknown_district', 'districtIds.0'],
    ['a region code that names no region', () => ({ regionCodes: ['NO-SUCH-REGION'], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'set-up' }), 'unknown_region', 'regionCodes.0'],
  ];
  for (const [what, body, code, field] of bad) {
    it(`when the body has ${what}, then the answer is 400 ${code} naming ${field} and nothing is written`, async () => {
      const d = await makeDistrict(t.ds);
      const before = await countRows(t.ds, ...TABLES);
      const res = await admin.put('/api/districts/profiles').send(body(d.id) as object);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
      expect(await countRows(t.ds, ...TABLES)).toEqual(before);
    });
  }

  it('when an admin assigns a profile with a 02-29 biofix to districts, then each is replaced, audited with before and after, and shown in the District file', async () => {
    const a = await makeDistrict(t.ds);
    const b = await makeDistrict(t.ds);
    await t.ds.query(`INSERT INTO district_profiles (district_id, profile_id, biofix) VALUES ($1, 'culex-wnv', NULL)`, [a.id]);
    const res = await admin.put('/api/districts/profiles').send({
      districtIds: [a.id, b.id], profiles: [{ profileId: 'aedes-aegypti-dengue', biofix: '02-29' }, { profileId: 'aedes-albopictus-dengue', biofix: null }], reason: 'national set-up',
    });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ updated: 2 });
    const rows = await t.ds.query(`SELECT district_id, profile_id, biofix, assigned_by FROM district_profiles WHERE district_id = ANY($1) ORDER BY district_id, profile_id`, [[a.id, b.id]]);
    expect(rows).toHaveLength(4);
    expect(rows.every((r: { assigned_by: string }) => r.assigned_by === adminId)).toBe(true);
    const [audit] = await t.ds.query(`SELECT actor_id, before, after, reason, at FROM audit_events WHERE action = 'district.profiles-assigned' AND entity_id = $1`, [a.id]);
    expect(audit.actor_id).toBe(adminId);
    expect(audit.reason).toBe('national set-up');
    expect(audit.before).toEqual({ profiles: [{ profileId: 'culex-wnv', biofix: null }] });
    expect(audit.after.profiles).toHaveLength(2);
    expect(audit.at).toBeTruthy();
    const file = await officer.get(`/api/districts/${a.id}/file`);
    expect(file.status).toBe(200);
    const shown = file.body.profiles.find((p: { profileId: string }) => p.profileId === 'aedes-aegypti-dengue');
    expect(shown).toMatchObject({ biofix: '02-29', assignedBy: expect.any(String), assignedAt: expect.any(String) });
  });

  it('when a district with weather has no profile, then the season run says so; after an assignment with a 02-29 biofix, the next run of a common year computes it with the model', async () => {
    const d = await makeSeasonDistrict(t.ds, { warmth: 2 });
    await t.ds.query(`DELETE FROM district_profiles WHERE district_id = $1`, [d.id]);
    const first = await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(first!.warnings.some((w) => w.code === 'no_profiles' && w.districtId === d.id)).toBe(true);
    const none = await t.ds.query(`SELECT count(*)::int AS n FROM vector_clock_seasons WHERE district_id = $1`, [d.id]);
    expect(none[0].n).toBe(0);

    const res = await admin.put('/api/districts/profiles').send({ districtIds: [d.id], profiles: [{ profileId: 'aedes-aegypti-dengue', biofix: '02-29' }], reason: 'assign for the season' });
    expect(res.status).toBe(200);
    // An incremental run: only districts whose input fingerprint changed are recomputed.
    const second = await runSeasonNow(t.ctx, { asOf: AS_OF, full: false });
    expect(second!.error).toBeNull();
    expect(second!.warnings.filter((w) => w.districtId === d.id)).toEqual([]);
    const [clock] = await t.ds.query(`SELECT profile_id FROM vector_clock_seasons WHERE district_id = $1 AND season_year = 2026`, [d.id]);
    expect(clock.profile_id).toBe('aedes-aegypti-dengue');
    const [tier] = await t.ds.query(`SELECT profile_id FROM district_tiers WHERE district_id = $1 ORDER BY epi_year DESC, epi_week DESC LIMIT 1`, [d.id]);
    expect(tier.profile_id).toBe('aedes-aegypti-dengue');
  });
});

describe('local variants', () => {
  it('when an admin adds a variant with a sourced change, then it is stored beside the untouched published profile and audited', async () => {
    const res = await admin.post('/api/profiles/aedes-aegypti-dengue/variants').send({
      id: 'aedes-aegypti-dengue-coastal', name: 'Aedes aegypti – dengue (coastal strain)', reason: 'local colony',
      changes: [{ path: 'development.lowerThreshold', value: 11.5, source: 'Ministry entomology unit, colony rearing 2025, table 2' }],
    });
    expect(res.status).toBe(201);
    const lower = res.body.parameters.find((p: { path: string }) => p.path === 'development.lowerThreshold');
    expect(lower.value).toBe(11.5);
    expect(lower.source.title).toContain('colony rearing');
    const list = (await officer.get('/api/profiles')).body.profiles;
    const published = list.find((p: { id: string }) => p.id === 'aedes-aegypti-dengue');
    expect(published.parameters.find((p: { path: string }) => p.path === 'development.lowerThreshold').value).not.toBe(11.5);
    expect(list.find((p: { id: string }) => p.id === 'aedes-aegypti-dengue-coastal').kind).toBe('variant');
    const audits = await t.ds.query(`SELECT count(*)::int AS n FROM audit_events WHERE action = 'profile.variant-created'`);
    expect(audits[0].n).toBe(1);
  });

  it('when a change has no source or names no parameter, then the answer is 400 naming the field and nothing is written', async () => {
    const before = await countRows(t.ds, ...TABLES);
    const noSource = await admin.post('/api/profiles/culex-wnv/variants').send({ id: 'culex-x', name: 'X', reason: 'test', changes: [{ path: 'development.lowerThreshold', value: 10 }] });
    expect(noSource.status).toBe(400);
    expect(noSource.body.error.fields.map((f: { path: string }) => f.path)).toContain('changes.0.source');
    const noParam = await admin.post('/api/profiles/culex-wnv/variants').send({ id: 'culex-x', name: 'X', reason: 'test', changes: [{ path: 'nothing.here', value: 10, source: 'a paper' }] });
    expect(noParam.status).toBe(400);
    expect(noParam.body.error.fields.map((f: { path: string }) => f.path)).toContain('changes.0.path');
    expect(await countRows(t.ds, ...TABLES)).toEqual(before);
  });

  it('when someone tries to edit a published profile in place, then there is no such route', async () => {
    const res = await admin.put('/api/profiles/culex-wnv').send({ name: 'edited' });
    expect(res.status).toBe(404);
  });
});
