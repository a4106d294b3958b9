import type { EntityManager } from 'typeorm';
import type { FieldTeamBody } from '../../shared/api/field.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { type Principal, seesAllDistricts } from '../auth/principal';
import { DistrictEntity } from '../districts/district.entity';
import { badRequest, HttpError, notFound } from '../http/errors';
import { isUniqueViolation } from '../platform/database-errors';
import { FieldTeamEntity } from './field-team.entity';
import { FieldTeamsRepository, presentTeam } from './field-teams.repository';

/** The field teams the health officer keeps (issue 19). */
export class FieldTeamsService {
  constructor(private readonly ctx: AppContext) {}

  /** Every team; a community worker sees only the teams they are on (district scoping as for surveys). */
  async list(p: Principal) {
    const teams = await new FieldTeamsRepository(this.ctx.ds.manager).list(seesAllDistricts(p) ? {} : { memberId: p.userId });
    return { teams: teams.map(presentTeam) };
  }

  /** The people the officer may put on a team. */
  async candidates() {
    return { people: await new FieldTeamsRepository(this.ctx.ds.manager).candidates() };
  }

  async create(p: Principal, body: FieldTeamBody) {
    return this.write(async (manager) => {
      await this.check(manager, body);
      const team = await manager.save(FieldTeamEntity, manager.create(FieldTeamEntity, {
        name: body.name, baseDistrictId: body.baseDistrictId, kinds: body.kinds, daysPerWeek: body.daysPerWeek,
      }));
      const repo = new FieldTeamsRepository(manager);
      await repo.replaceMembers(team.id, body.memberIds);
      await recordAudit(manager, { actorId: p.userId, action: 'field-team.created', entity: 'field_team', entityId: team.id, after: body });
      return presentTeam((await repo.list({ ids: [team.id] }))[0]);
    });
  }

  async update(p: Principal, id: string, body: FieldTeamBody) {
    return this.write(async (manager) => {
      const repo = new FieldTeamsRepository(manager);
      const [before] = await repo.list({ ids: [id] });
      if (!before) throw notFound('The team');
      await this.check(manager, body);
      await manager.update(FieldTeamEntity, { id }, { name: body.name, baseDistrictId: body.baseDistrictId, kinds: body.kinds, daysPerWeek: body.daysPerWeek, updatedAt: new Date() });
      await repo.replaceMembers(id, body.memberIds);
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-team.updated', entity: 'field_team', entityId: id,
        before: { name: before.name, baseDistrictId: before.baseDistrict.id, memberIds: before.members.map((m) => m.id), kinds: before.kinds, daysPerWeek: before.daysPerWeek },
        after: body,
      });
      return presentTeam((await repo.list({ ids: [id] }))[0]);
    });
  }

  /** Retire a team: it stays on the weeks that name it and leaves new proposals. Retiring twice changes nothing more. */
  async retire(p: Principal, id: string) {
    return this.ctx.ds.transaction(async (manager) => {
      const repo = new FieldTeamsRepository(manager);
      const [before] = await repo.list({ ids: [id] });
      if (!before) throw notFound('The team');
      if (!before.retiredAt) {
        await manager.update(FieldTeamEntity, { id }, { retiredAt: new Date(), updatedAt: new Date() });
        await recordAudit(manager, { actorId: p.userId, action: 'field-team.retired', entity: 'field_team', entityId: id, before: { retiredAt: null }, after: { retired: true } });
      }
      return presentTeam((await repo.list({ ids: [id] }))[0]);
    });
  }

  async remove(p: Principal, id: string) {
    await this.ctx.ds.transaction(async (manager) => {
      const [before] = await new FieldTeamsRepository(manager).list({ ids: [id] });
      if (!before) throw notFound('The team');
      await manager.delete(FieldTeamEntity, { id });
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-team.deleted', entity: 'field_team', entityId: id,
        before: { name: before.name, baseDistrictId: before.baseDistrict.id, memberIds: before.members.map((m) => m.id), kinds: before.kinds, daysPerWeek: before.daysPerWeek },
      });
    });
  }

  /** The base must be a known district and every member an active officer or community worker (400 naming the field). */
  private async check(manager: EntityManager, body: FieldTeamBody) {
    if (!(await manager.existsBy(DistrictEntity, { id: body.baseDistrictId })))
      throw badRequest('unknown_district', 'The base district does not exist.', [{ path: 'baseDistrictId', message: 'is not a known district' }]);
    const eligible = await new FieldTeamsRepository(manager).eligibleMembers(body.memberIds);
    const refused = body.memberIds.filter((m) => !eligible.has(m));
    if (refused.length)
      throw badRequest('invalid_member', 'Team members must be active health officers or community workers.',
        refused.map((id) => ({ path: `memberIds.${body.memberIds.indexOf(id)}`, message: 'is not an active health officer or community worker' })));
  }

  /** One transaction; a taken name (also when two officers save at once) is a 409 naming the field. */
  private async write<T>(work: (manager: EntityManager) => Promise<T>): Promise<T> {
    try {
      return await this.ctx.ds.transaction(work);
    } catch (err) {
      if (isUniqueViolation(err)) throw new HttpError(409, 'team_name_taken', 'Another team already has this name.', [{ path: 'name', message: 'is taken by another team' }]);
      throw err;
    }
  }
}
