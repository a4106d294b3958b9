import jwt from 'jsonwebtoken';
import type { EntityManager } from 'typeorm';
import type { MailKind, SubscriptionsBody, SubscriptionsResponse, UnsubscribeResponse } from '../../shared/api/bulletins.schema';
import type { Role } from '../../shared/roles';
import type { Language } from '../../shared/api/auth.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { type Principal, seesAllDistricts } from '../auth/principal';
import type { Config } from '../config';
import { badRequest, conflict, forbidden } from '../http/errors';
import { unsubscribeHeaders } from './bulletin-texts';
import { SubscriptionEntity } from './subscription.entity';

const UNSUBSCRIBE_AUDIENCE = 'broodcast-unsubscribe';
const ALL_KINDS: MailKind[] = ['advisory', 'bulletin'];

// The recipients' SQL lives in the repository; re-exported here for the callers that import it from the service.
export { recipientsOf, type Recipient } from './recipients.repository';

/**
 * A signed, non-expiring unsubscribe token (HS256 with JWT_SECRET) for one user and either one district
 * (an advisory mail: stop all mail for that district) or, with no district, the weekly bulletin (the
 * digest: stop the weekly bulletin for every district, advisories stay).
 */
export function unsubscribeToken(config: Config, userId: string, districtId: string | null): string {
  return jwt.sign(districtId ? { did: districtId } : { kind: 'bulletin' }, config.JWT_SECRET, { subject: userId, audience: UNSUBSCRIBE_AUDIENCE, issuer: 'broodcast', algorithm: 'HS256' });
}

export const preferencesLink = (config: Config) => new URL('/preferences', config.APP_URL).toString();

/**
 * Everything a subscription mail needs to let its reader leave: the link to the confirmation page (opening
 * it changes nothing) and the List-Unsubscribe headers whose one-click POST (RFC 8058) does the change.
 */
export function subscriberLinks(config: Config, userId: string, districtId: string | null) {
  const token = unsubscribeToken(config, userId, districtId);
  return {
    unsubscribeUrl: new URL(`/unsubscribe?token=${token}`, config.APP_URL).toString(),
    preferencesUrl: preferencesLink(config),
    headers: unsubscribeHeaders(new URL(`/api/unsubscribe/${token}`, config.APP_URL).toString()),
  };
}

/** A user's assigned districts (their own and every district of their regions) and whether they are scoped to regions. */
async function assignedOf(manager: EntityManager, userId: string): Promise<{ assigned: string[]; regional: boolean }> {
  const [row] = await manager.query(
    `SELECT ARRAY(SELECT district_id FROM user_districts WHERE user_id = $1
                  UNION SELECT d.id FROM user_regions ur JOIN districts d ON d.region_id = ur.region_id WHERE ur.user_id = $1) AS assigned,
            EXISTS (SELECT 1 FROM user_regions WHERE user_id = $1) AS regional`, [userId]);
  return { assigned: row.assigned as string[], regional: row.regional as boolean };
}

/** What an unsubscribe token stops: all mail for one district, or the weekly bulletin everywhere. */
type UnsubscribeScope = { userId: string; districtId: string } | { userId: string; districtId: null };

export class SubscriptionsService {
  constructor(private readonly ctx: AppContext) {}

  /** The districts this person may receive mail for, and what they receive for each. */
  async mine(p: Principal): Promise<SubscriptionsResponse> {
    const districts = await this.visibleDistricts(this.ctx.ds.manager, p.userId, p.role);
    const rows = await this.ctx.ds.getRepository(SubscriptionEntity).findBy({ userId: p.userId });
    const chosen = rows.length > 0;
    const byDistrict = new Map(rows.map((r) => [r.districtId, r]));
    const defaults = this.defaultFor(p.role, p.districtIds, (p.regionIds ?? []).length > 0);
    return {
      source: chosen ? 'chosen' : 'default',
      email: p.email,
      districts: districts.map((d) => {
        const kinds = chosen ? (byDistrict.get(d.id)?.active ? byDistrict.get(d.id)!.kinds : []) : defaults(d.id);
        return { districtId: d.id, districtCode: d.code, districtName: d.name, advisory: kinds.includes('advisory'), bulletin: kinds.includes('bulletin') };
      }),
    };
  }

  /** Save the person's choice for every district they may receive; districts left out receive nothing. */
  async save(p: Principal, body: SubscriptionsBody): Promise<SubscriptionsResponse> {
    await this.ctx.ds.transaction(async (manager) => {
      const visible = new Set((await this.visibleDistricts(manager, p.userId, p.role)).map((d) => d.id));
      const bad = body.districts.findIndex((d) => !visible.has(d.districtId));
      if (bad >= 0) {
        if (!seesAllDistricts(p)) throw forbidden('You may receive mail only for your own district.');
        throw badRequest('unknown_district', 'One of the districts does not exist.', [{ path: `districts.${bad}.districtId`, message: 'is not a district' }]);
      }
      const before = await manager.findBy(SubscriptionEntity, { userId: p.userId });
      const choice = new Map(body.districts.map((d) => [d.districtId, ALL_KINDS.filter((k) => d[k])]));
      await this.writeAll(manager, p.userId, [...visible].map((id) => ({ districtId: id, kinds: choice.get(id) ?? [] })));
      await recordAudit(manager, {
        actorId: p.userId, action: 'subscriptions.updated', entity: 'user', entityId: p.userId,
        before: before.filter((r) => r.active).map((r) => ({ districtId: r.districtId, kinds: r.kinds })),
        after: [...choice.entries()].filter(([, k]) => k.length).map(([districtId, kinds]) => ({ districtId, kinds })),
      });
    });
    return this.mine(p);
  }

  private scopeOf(token: string): UnsubscribeScope {
    try {
      const claims = jwt.verify(token, this.ctx.config.JWT_SECRET, { audience: UNSUBSCRIBE_AUDIENCE, issuer: 'broodcast', algorithms: ['HS256'] });
      if (typeof claims === 'string' || typeof claims.sub !== 'string') throw new Error('claims');
      if (typeof claims.did === 'string') return { userId: claims.sub, districtId: claims.did };
      if (claims.kind === 'bulletin') return { userId: claims.sub, districtId: null };
      throw new Error('claims');
    } catch {
      throw badRequest('token_invalid', 'This unsubscribe link is not valid. Sign in and change your mail on the preferences page.', [
        { path: 'token', message: 'is not a valid unsubscribe link' },
      ]);
    }
  }

  private async target(manager: EntityManager, scope: UnsubscribeScope) {
    const [user] = await manager.query(`SELECT id, email, role, language FROM users WHERE id = $1`, [scope.userId]);
    const [district] = scope.districtId ? await manager.query(`SELECT name FROM districts WHERE id = $1`, [scope.districtId]) : [null];
    if (!user || (scope.districtId && !district)) throw badRequest('token_invalid', 'This unsubscribe link no longer matches an account or district.', [
      { path: 'token', message: 'no longer matches an account or district' },
    ]);
    return { user: user as { id: string; email: string; role: Role; language: Language }, districtName: (district?.name as string | undefined) ?? null };
  }

  /** Whether the scope still receives anything (its district's mail, or any weekly bulletin). */
  private async receiving(manager: EntityManager, scope: UnsubscribeScope, role: Role): Promise<boolean> {
    const rows = await manager.findBy(SubscriptionEntity, { userId: scope.userId });
    if (rows.length === 0) {
      const { assigned, regional } = await assignedOf(manager, scope.userId);
      const defaults = this.defaultFor(role, assigned, regional);
      if (scope.districtId) return defaults(scope.districtId).length > 0;
      return (await this.visibleDistricts(manager, scope.userId, role)).some((d) => defaults(d.id).includes('bulletin'));
    }
    return scope.districtId
      ? rows.some((r) => r.districtId === scope.districtId && r.active && r.kinds.length > 0)
      : rows.some((r) => r.active && r.kinds.includes('bulletin'));
  }

  /** The confirmation page's question (opening the link changes nothing): whose mail, what it stops, in their language. */
  async describe(token: string): Promise<UnsubscribeResponse> {
    const scope = this.scopeOf(token);
    const { user, districtName } = await this.target(this.ctx.ds.manager, scope);
    return {
      email: user.email, districtName, scope: scope.districtId ? 'district' : 'bulletin', language: user.language,
      subscribed: await this.receiving(this.ctx.ds.manager, scope, user.role),
    };
  }

  /**
   * Stop the mail the token names, no sign-in: the confirmation page's button, or a mail program's one-click
   * POST (RFC 8058). The rows as they were are kept in the audit event, so undo puts them back.
   */
  async unsubscribe(token: string): Promise<UnsubscribeResponse> {
    const scope = this.scopeOf(token);
    await this.ctx.ds.transaction(async (manager) => {
      const { user } = await this.target(manager, scope);
      let rows = await manager.findBy(SubscriptionEntity, { userId: user.id });
      if (rows.length === 0) {
        // Nothing chosen yet: write the role default as explicit rows first, so only what the token names changes.
        const { assigned, regional } = await assignedOf(manager, user.id);
        const defaults = this.defaultFor(user.role, assigned, regional);
        const visible = await this.visibleDistricts(manager, user.id, user.role);
        await this.writeAll(manager, user.id, visible.map((d) => ({ districtId: d.id, kinds: defaults(d.id) })));
        rows = await manager.findBy(SubscriptionEntity, { userId: user.id });
      }
      const before = rows.filter((r) => (scope.districtId ? r.districtId === scope.districtId : r.kinds.includes('bulletin')))
        .map((r) => ({ districtId: r.districtId, kinds: r.kinds, active: r.active }));
      if (scope.districtId) {
        await manager.upsert(SubscriptionEntity, { userId: user.id, districtId: scope.districtId, kinds: [], active: false }, ['userId', 'districtId']);
      } else {
        for (const r of before) {
          const kinds = r.kinds.filter((k) => k !== 'bulletin');
          await manager.update(SubscriptionEntity, { userId: user.id, districtId: r.districtId }, { kinds, active: kinds.length > 0 });
        }
      }
      await recordAudit(manager, {
        actorId: user.id, action: 'subscriptions.unsubscribed', entity: 'user', entityId: user.id,
        before, after: { districtId: scope.districtId, stopped: scope.districtId ? 'all' : 'bulletin' }, reason: 'unsubscribe link in a mail',
      });
    });
    return this.describe(token);
  }

  /** Undo from the confirmation page: put back the rows the newest unsubscribe of this scope changed. */
  async undo(token: string): Promise<UnsubscribeResponse> {
    const scope = this.scopeOf(token);
    await this.ctx.ds.transaction(async (manager) => {
      const { user } = await this.target(manager, scope);
      const [event] = await manager.query(
        `SELECT id, before FROM audit_events
          WHERE action = 'subscriptions.unsubscribed' AND entity = 'user' AND entity_id = $1 AND (after->>'districtId') IS NOT DISTINCT FROM $2::text
          ORDER BY id DESC LIMIT 1`,
        [user.id, scope.districtId],
      );
      if (!event) throw conflict('nothing_to_undo', 'There is no unsubscribe to undo for this link.');
      const before = (event.before ?? []) as { districtId: string; kinds: MailKind[]; active: boolean }[];
      for (const r of before) {
        const visible = (await this.visibleDistricts(manager, user.id, user.role)).some((d) => d.id === r.districtId);
        if (!visible) continue; // a community worker no longer assigned there does not get it back
        if (scope.districtId) {
          await manager.upsert(SubscriptionEntity, { userId: user.id, districtId: r.districtId, kinds: r.kinds, active: r.active }, ['userId', 'districtId']);
        } else {
          const [now] = await manager.findBy(SubscriptionEntity, { userId: user.id, districtId: r.districtId });
          const kinds = ALL_KINDS.filter((k) => k === 'bulletin' || now?.kinds.includes(k));
          await manager.upsert(SubscriptionEntity, { userId: user.id, districtId: r.districtId, kinds, active: true }, ['userId', 'districtId']);
        }
      }
      await recordAudit(manager, {
        actorId: user.id, action: 'subscriptions.resubscribed', entity: 'user', entityId: user.id,
        after: { districtId: scope.districtId, restored: before }, reason: 'undo on the unsubscribe page',
      });
    });
    return this.describe(token);
  }

  /** The same rule as `defaultSql` in recipients.repository.ts; `regional`: the user is scoped to at least one region. */
  private defaultFor(role: Role, assigned: string[], regional: boolean) {
    return (districtId: string): MailKind[] =>
      ((role === 'officer' || role === 'supervisor') && (!regional || assigned.includes(districtId))) ||
      ((role === 'epidemiologist' || role === 'worker') && assigned.includes(districtId))
        ? [...ALL_KINDS]
        : [];
  }

  /** Community workers may receive their own districts only; everybody else any district. */
  private async visibleDistricts(manager: EntityManager, userId: string, role: Role): Promise<{ id: string; code: string; name: string }[]> {
    return role === 'worker'
      ? manager.query(
          `SELECT d.id, d.code, d.name FROM districts d
            WHERE d.id IN (SELECT district_id FROM user_districts WHERE user_id = $1)
               OR d.region_id IN (SELECT region_id FROM user_regions WHERE user_id = $1)
            ORDER BY d.code`, [userId])
      : manager.query(`SELECT id, code, name FROM districts ORDER BY code`);
  }

  private async writeAll(manager: EntityManager, userId: string, rows: { districtId: string; kinds: MailKind[] }[]) {
    await manager.delete(SubscriptionEntity, { userId });
    if (rows.length)
      await manager.insert(SubscriptionEntity, rows.map((r) => ({ userId, districtId: r.districtId, kinds: r.kinds, active: r.kinds.length > 0 })));
  }
}

/**
 * The demo seed's subscriptions (called inside seedDemoIfEmpty's transaction): each demo user gets
 * explicit rows equal to their role default, and the demo admin the advisories of every district.
 */
export async function seedDemoSubscriptions(manager: EntityManager): Promise<void> {
  await manager.query(
    `INSERT INTO subscriptions (user_id, district_id, kinds, active)
     SELECT u.id, d.id,
            CASE WHEN u.role = 'admin' THEN ARRAY['advisory']::text[] ELSE ARRAY['advisory', 'bulletin']::text[] END, true
       FROM users u CROSS JOIN districts d
      WHERE u.role IN ('admin', 'officer', 'supervisor')
         OR EXISTS (SELECT 1 FROM user_districts ud WHERE ud.user_id = u.id AND ud.district_id = d.id)
     ON CONFLICT (user_id, district_id) DO NOTHING`,
  );
}
