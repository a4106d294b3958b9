import type { AssignProfilesBody, ProfilesResponse, ProfileVariantBody } from '../../shared/api/profiles.schema';
import { findProfile, loadProfiles } from '../../shared/model';
import { profileSchema, type Profile } from '../../shared/model/profile.schema';
import type { AppContext } from '../app-context';
import { recordAudit, recordAudits } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { badRequest, conflict, notFound } from '../http/errors';
import { presentProfile, profileParameters } from './profiles.presenter';
import { RegionsRepository } from '../districts/regions.repository';
import { ProfilesRepository } from './profiles.repository';

/** The profile library (published profiles shipped as data, plus local variants) and its assignment to districts. */
export class ProfilesService {
  private readonly repo: ProfilesRepository;
  private readonly regions: RegionsRepository;

  constructor(private readonly ctx: AppContext) {
    this.repo = new ProfilesRepository(ctx.ds);
    this.regions = new RegionsRepository(ctx.ds);
  }

  async list(): Promise<ProfilesResponse> {
    const published = loadProfiles().map((p) => presentProfile(p, { kind: 'published' }));
    const variants = (await this.repo.variants()).map((v) =>
      presentProfile(v.profile as Profile, { kind: 'variant', baseProfileId: v.baseProfileId, createdBy: v.createdBy, createdAt: v.createdAt }));
    return { profiles: [...published, ...variants] };
  }

  /**
   * Replace the profile assignment of many districts at once, in one transaction, audited per district.
   * Only published profiles are assignable for now: the season run computes from the shipped library.
   */
  async assign(actor: Principal, body: AssignProfilesBody): Promise<{ updated: number }> {
    const fields = body.profiles.flatMap((p, i) =>
      findProfile(p.profileId) ? [] : [{ path: `profiles.${i}.profileId`, message: `is not a published profile (${p.profileId})` }]);
    if (fields.length > 0) throw badRequest('unknown_profile', `Unknown profile: ${fields.map((f) => f.path).join(', ')}`, fields);
    return this.ctx.ds.transaction(async (m) => {
      const named = body.districtIds ?? [];
      const missing = await this.repo.missingDistricts(m, named);
      if (missing.length > 0) {
        throw badRequest('unknown_district', `Unknown district: ${missing.join(', ')}`,
          missing.map((id) => ({ path: `districtIds.${named.indexOf(id)}`, message: 'is not a district' })));
      }
      // Regions name all their districts (issue 17): an unknown code is a 400 naming it, nothing written.
      const codes = body.regionCodes ?? [];
      const regionIds = codes.length ? await this.regions.idsByCode(m, codes) : new Map<string, string>();
      const unknown = codes.flatMap((c, i) => (regionIds.has(c.toUpperCase()) ? [] : [{ path: `regionCodes.${i}`, message: `is not a region (${c})` }]));
      if (unknown.length > 0) throw badRequest('unknown_region', `Unknown region: ${unknown.map((f) => f.path).join(', ')}`, unknown);
      const ofRegions = regionIds.size ? await this.regions.districtIdsOf(m, [...regionIds.values()]) : [];
      const districtIds = [...new Set([...named, ...ofRegions])].sort();
      const before = await this.repo.assignments(m, districtIds);
      await this.repo.replaceAssignments(m, districtIds, body.profiles, actor.userId);
      const beforeBy = new Map<string, { profileId: string; biofix: string | null }[]>();
      for (const r of before) {
        if (!beforeBy.has(r.districtId)) beforeBy.set(r.districtId, []);
        beforeBy.get(r.districtId)!.push({ profileId: r.profileId, biofix: r.biofix });
      }
      const after = body.profiles.map((p) => ({ profileId: p.profileId, biofix: p.biofix }));
      await recordAudits(m, districtIds.map((id) => ({
        actorId: actor.userId, action: 'district.profiles-assigned', entity: 'district', entityId: id,
        before: { profiles: beforeBy.get(id) ?? [] }, after: { profiles: after, regionCodes: body.regionCodes ?? [] }, reason: body.reason,
      })));
      return { updated: districtIds.length };
    });
  }

  /** Copy a published profile under a new id and name with sourced changes; the published one stays as shipped. */
  async createVariant(actor: Principal, baseId: string, body: ProfileVariantBody) {
    const base = findProfile(baseId);
    if (!base) throw notFound('The published profile');
    const known = new Map(profileParameters(base).map((p) => [p.path, p]));
    const copy = structuredClone(base) as unknown as Record<string, unknown>;
    const changes: { path: string; before: unknown; after: unknown; source: string }[] = [];
    const fields: { path: string; message: string }[] = [];
    body.changes.forEach((c, i) => {
      const param = known.get(c.path);
      if (!param || typeof param.value !== 'number') {
        fields.push({ path: `changes.${i}.path`, message: 'is not a numeric parameter of this profile' });
        return;
      }
      if (c.value === undefined && c.low === undefined && c.high === undefined) {
        fields.push({ path: `changes.${i}.value`, message: 'give a value, low or high' });
        return;
      }
      const node = c.path.split('.').reduce<Record<string, unknown>>((n, k) => n[k] as Record<string, unknown>, copy);
      const before = { value: node.value, low: node.low, high: node.high, source: node.source };
      if (c.value !== undefined) node.value = c.value;
      if (c.low !== undefined) node.low = c.low;
      if (c.high !== undefined) node.high = c.high;
      // The admin's text is the source of the changed value; the year is the year of the change.
      node.source = { author: actor.displayName, year: new Date().getUTCFullYear(), title: c.source };
      node.note = `Local change from the published ${String(before.value)}`;
      changes.push({ path: c.path, before, after: { value: node.value, low: node.low, high: node.high }, source: c.source });
    });
    if (fields.length > 0) throw badRequest('invalid_input', `The body is not valid: ${fields.map((f) => `${f.path} ${f.message}`).join('; ')}`, fields);
    copy.id = body.id;
    copy.name = body.name;
    const parsed = profileSchema.safeParse(copy);
    if (!parsed.success) {
      const f = parsed.error.issues.map((iss) => ({ path: `changes (${iss.path.join('.')})`, message: iss.message }));
      throw badRequest('invalid_variant', `The changed profile is not valid: ${f.map((x) => `${x.path} ${x.message}`).join('; ')}`, f);
    }
    return this.ctx.ds.transaction(async (m) => {
      if (findProfile(body.id) || (await this.repo.variantExists(m, body.id))) {
        throw conflict('profile_exists', `A profile with the id ${body.id} already exists.`);
      }
      const saved = await this.repo.insertVariant(m, {
        id: body.id, baseProfileId: base.id, name: body.name, profile: parsed.data, changes, createdBy: actor.userId,
      });
      await recordAudit(m, {
        actorId: actor.userId, action: 'profile.variant-created', entity: 'profile', entityId: body.id,
        before: { baseProfileId: base.id }, after: { name: body.name, changes }, reason: body.reason,
      });
      return presentProfile(parsed.data, { kind: 'variant', baseProfileId: base.id, createdBy: saved.createdBy, createdAt: saved.createdAt });
    });
  }
}
