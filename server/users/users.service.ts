import type { PreferencesBody, PreferencesDto, UserInviteBody, UserUpdateBody } from '../../shared/api/users.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { inviteLink, inviteMail } from '../auth/auth.mails';
import type { Principal } from '../auth/principal';
import { SessionsRepository } from '../auth/sessions.repository';
import { issueToken } from '../auth/tokens.repository';
import { badRequest, conflict, notFound } from '../http/errors';
import { DEFAULT_LANGUAGE } from '../i18n';
import { enqueueMail } from '../outbox/outbox.repository';
import { preferencesOf, presentUser } from './user.presenter';
import { UserEntity } from './user.entity';
import { UsersRepository } from './users.repository';

const INVITE_TTL_HOURS = 72;

export class UsersService {
  private readonly users: UsersRepository;
  private readonly sessions: SessionsRepository;

  constructor(private readonly ctx: AppContext) {
    this.users = new UsersRepository(ctx.ds);
    this.sessions = new SessionsRepository(ctx.ds);
  }

  async list() {
    return { users: (await this.users.listWithDistricts()).map(presentUser) };
  }

  /**
   * Create the account without a password and put the one-time link to choose one in the outbox, in the
   * same transaction: the invitation exists if and only if its mail is queued, and a mail server that is
   * down loses nothing (the outbox worker sends and retries). The link carries the invitee's language
   * (`&lang=`), so the landing page opens in the language of the mail.
   */
  async invite(actor: Principal, body: UserInviteBody) {
    const language = body.language ?? DEFAULT_LANGUAGE;
    const user = await this.ctx.ds.transaction(async (manager) => {
      if (await manager.existsBy(UserEntity, { email: body.email }))
        throw conflict('email_taken', 'A user with this e-mail already exists.');
      await this.checkDistricts(manager, body.districtIds);
      const user = await manager.save(UserEntity, manager.create(UserEntity, {
        email: body.email,
        displayName: body.displayName,
        role: body.role,
        passwordHash: null,
        active: true,
        language,
      }));
      await this.users.setDistricts(manager, user.id, body.districtIds);
      await this.checkRegions(manager, body.regionIds);
      await this.users.setRegions(manager, user.id, body.regionIds);
      const token = await issueToken(manager, user.id, 'invite', INVITE_TTL_HOURS);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'user.invited', entity: 'user', entityId: user.id,
        after: { email: user.email, role: user.role, districtIds: body.districtIds, regionIds: body.regionIds, language: user.language },
      });
      const link = inviteLink(this.ctx.config.APP_URL, token, language);
      await enqueueMail(manager, this.ctx.config, [
        { kind: 'invite', to: body.email, userId: user.id, ...inviteMail(body.displayName, body.role, link, INVITE_TTL_HOURS, language) },
      ]);
      return this.users.findWithDistricts(user.id, manager);
    });
    return presentUser(user!);
  }

  async update(actor: Principal, id: string, body: UserUpdateBody) {
    const updated = await this.ctx.ds.transaction(async (manager) => {
      const current = await this.users.findWithDistricts(id, manager);
      if (!current) throw notFound('The user');
      if (actor.userId === id && (body.role !== undefined && body.role !== current.user.role || body.active === false))
        throw badRequest('own_account', 'You cannot change your own role or deactivate yourself.', [
          { path: body.active === false ? 'active' : 'role', message: 'cannot be changed on your own account' },
        ]);
      const before = { displayName: current.user.displayName, role: current.user.role, active: current.user.active,
        districtIds: current.districts.map((d) => d.id), regionIds: current.regions.map((r) => r.id) };
      const patch: Partial<UserEntity> = {};
      if (body.displayName !== undefined) patch.displayName = body.displayName;
      if (body.role !== undefined) patch.role = body.role;
      if (body.active !== undefined) patch.active = body.active;
      if (Object.keys(patch).length) await manager.update(UserEntity, { id }, patch);
      if (body.districtIds) {
        await this.checkDistricts(manager, body.districtIds);
        await this.users.setDistricts(manager, id, body.districtIds);
      }
      if (body.regionIds) {
        await this.checkRegions(manager, body.regionIds);
        await this.users.setRegions(manager, id, body.regionIds);
      }
      // A change of privilege ends the user's sessions: they sign in again with the new rights.
      const privilegeChanged = (body.role && body.role !== before.role) || body.active === false ||
        (body.districtIds && body.districtIds.join() !== before.districtIds.join()) ||
        (body.regionIds && [...body.regionIds].sort().join() !== [...before.regionIds].sort().join());
      if (privilegeChanged) await this.sessions.revokeAllOf(manager, id);
      const after = await this.users.findWithDistricts(id, manager);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'user.updated', entity: 'user', entityId: id, before,
        after: { displayName: after!.user.displayName, role: after!.user.role, active: after!.user.active,
          districtIds: after!.districts.map((d) => d.id), regionIds: after!.regions.map((r) => r.id) },
      });
      return after!;
    });
    return presentUser(updated);
  }

  /** The signed-in user's own language and display units; audited like every other change to a user. */
  async updatePreferences(actor: Principal, body: PreferencesBody): Promise<PreferencesDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const user = await manager.findOneBy(UserEntity, { id: actor.userId });
      if (!user) throw notFound('The user');
      const before = preferencesOf(user);
      const patch: Partial<UserEntity> = {};
      if (body.language !== undefined) patch.language = body.language;
      if (body.temperatureUnit !== undefined) patch.temperatureUnit = body.temperatureUnit;
      if (body.rainUnit !== undefined) patch.rainUnit = body.rainUnit;
      await manager.update(UserEntity, { id: actor.userId }, patch);
      const after = { ...before, ...body };
      await recordAudit(manager, { actorId: actor.userId, action: 'user.preferences-updated', entity: 'user', entityId: actor.userId, before, after });
      return after;
    });
  }

  private async checkRegions(manager: Parameters<UsersRepository['countExistingRegions']>[0], ids: string[]) {
    const unique = [...new Set(ids)];
    if ((await this.users.countExistingRegions(manager, unique)) !== unique.length)
      throw badRequest('unknown_region', 'One of the regions does not exist.', [
        { path: 'regionIds', message: 'contains a region that does not exist' },
      ]);
  }

  private async checkDistricts(manager: Parameters<UsersRepository['countExistingDistricts']>[0], ids: string[]) {
    const unique = [...new Set(ids)];
    if ((await this.users.countExistingDistricts(manager, unique)) !== unique.length)
      throw badRequest('unknown_district', 'One of the districts does not exist.', [
        { path: 'districtIds', message: 'contains a district that does not exist' },
      ]);
  }
}
