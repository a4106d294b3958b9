import jwt from 'jsonwebtoken';
import type { EntityManager } from 'typeorm';
import type { MailKind, SubscriptionsBody, SubscriptionsResponse } from '../../shared/api/bulletins.schema';
import type { Role } from '../../shared/roles';
import type { Language } from '../../shared/api/auth.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { type Principal, seesAllDistricts } from '../auth/principal';
import type { Config } from '../config';
import { badRequest, forbidden } from '../http/errors';
import { unsubscribeHeaders } from './bulletin-texts';
import { SubscriptionEntity } from './subscription.entity';

const UNSUBSCRIBE_AUDIENCE = 'broodcast-unsubscribe';
const ALL_KINDS: MailKind[] = ['advisory', 'bulletin'];

export interface Recipient {
  userId: string;
  email: string;
  displayName: string;
  /** The language their mail is written in (user preference). */
  language: Language;
}

/**
 * The role defaults of DESIGN.md §2 for a user who has chosen nothing yet: health officers and
 * supervisors receive every district, epidemiologists and community workers their assigned ones, and
 * admins nothing (they subscribe on the preferences page).
 */
const DEFAULT_SQL = `(u.role IN ('officer', 'supervisor')
   OR (u.role IN ('epidemiologist', 'worker') AND EXISTS (SELECT 1 FROM user_districts ud WHERE ud.user_id = u.id AND ud.district_id = $1)))`;

/** Who receives `kind` for a district now, in the caller's transaction. */
export async function recipientsOf(manager: EntityManager, districtId: string, kind: MailKind): Promise<Recipient[]> {
  return manager.query(
    `SELECT u.id AS "userId", u.email, u.display_name AS "displayName", u.language FROM users u
      WHERE u.active
        AND CASE WHEN EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = u.id)
                 THEN EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = u.id AND s.district_id = $1 AND s.active AND $2 = ANY (s.kinds))
                      -- a community worker's rows count only for a district they are (still) assigned to
                      AND (u.role <> 'worker' OR EXISTS (SELECT 1 FROM user_districts ud WHERE ud.user_id = u.id AND ud.district_id = $1))
                 ELSE ${DEFAULT_SQL} END
      ORDER BY u.email`,
    [districtId, kind],
  );
}

/** A signed, non-expiring one-click unsubscribe token for one user and district (HS256 with JWT_SECRET). */
export function unsubscribeToken(config: Config, userId: string, districtId: string): string {
  return jwt.sign({ did: districtId }, config.JWT_SECRET, { subject: userId, audience: UNSUBSCRIBE_AUDIENCE, issuer: 'broodcast', algorithm: 'HS256' });
}

export function unsubscribeLink(config: Config, userId: string, districtId: string): string {
  return new URL(`/unsubscribe?token=${unsubscribeToken(config, userId, districtId)}`, config.APP_URL).toString();
}

export const preferencesLink = (config: Config) => new URL('/preferences', config.APP_URL).toString();

/** Everything a subscription mail needs to let its reader leave: the links and the List-Unsubscribe headers. */
export function subscriberLinks(config: Config, userId: string, districtId: string) {
  const token = unsubscribeToken(config, userId, districtId);
  return {
    unsubscribeUrl: new URL(`/unsubscribe?token=${token}`, config.APP_URL).toString(),
    preferencesUrl: preferencesLink(config),
    headers: unsubscribeHeaders(new URL(`/api/unsubscribe/${token}`, config.APP_URL).toString()),
  };
}

export class SubscriptionsService {
  constructor(private readonly ctx: AppContext) {}

  /** The districts this person may receive mail for, and what they receive for each. */
  async mine(p: Principal): Promise<SubscriptionsResponse> {
    const districts = await this.visibleDistricts(this.ctx.ds.manager, p.userId, p.role);
    const rows = await this.ctx.ds.getRepository(SubscriptionEntity).findBy({ userId: p.userId });
    const chosen = rows.length > 0;
    const byDistrict = new Map(rows.map((r) => [r.districtId, r]));
    const defaults = this.defaultFor(p.role, p.districtIds);
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

  /** One click from a mail, no sign-in: stop everything for the district in the signed token. */
  async unsubscribe(token: string): Promise<{ districtName: string; email: string }> {
    let userId: string;
    let districtId: string;
    try {
      const claims = jwt.verify(token, this.ctx.config.JWT_SECRET, { audience: UNSUBSCRIBE_AUDIENCE, issuer: 'broodcast', algorithms: ['HS256'] });
      if (typeof claims === 'string' || typeof claims.sub !== 'string' || typeof claims.did !== 'string') throw new Error('claims');
      userId = claims.sub;
      districtId = claims.did;
    } catch {
      throw badRequest('token_invalid', 'This unsubscribe link is not valid. Sign in and change your mail on the preferences page.', [
        { path: 'token', message: 'is not a valid unsubscribe link' },
      ]);
    }
    return this.ctx.ds.transaction(async (manager) => {
      const [user] = await manager.query(`SELECT id, email, role FROM users WHERE id = $1`, [userId]);
      const [district] = await manager.query(`SELECT name FROM districts WHERE id = $1`, [districtId]);
      if (!user || !district) throw badRequest('token_invalid', 'This unsubscribe link no longer matches an account or district.', [
        { path: 'token', message: 'no longer matches an account or district' },
      ]);
      const rows = await manager.findBy(SubscriptionEntity, { userId });
      if (rows.length === 0) {
        // Nothing chosen yet: write the role default as explicit rows first, so only this district changes.
        const assigned: string[] = (await manager.query(`SELECT district_id FROM user_districts WHERE user_id = $1`, [userId])).map((r: { district_id: string }) => r.district_id);
        const defaults = this.defaultFor(user.role, assigned);
        const visible = await this.visibleDistricts(manager, userId, user.role);
        await this.writeAll(manager, userId, visible.map((d) => ({ districtId: d.id, kinds: defaults(d.id) })));
      }
      await manager.upsert(SubscriptionEntity, { userId, districtId, kinds: [], active: false }, ['userId', 'districtId']);
      await recordAudit(manager, {
        actorId: userId, action: 'subscriptions.unsubscribed', entity: 'user', entityId: userId, after: { districtId }, reason: 'one-click link in a mail',
      });
      return { districtName: district.name, email: user.email };
    });
  }

  private defaultFor(role: Role, assigned: string[]) {
    return (districtId: string): MailKind[] =>
      role === 'officer' || role === 'supervisor' || ((role === 'epidemiologist' || role === 'worker') && assigned.includes(districtId)) ? [...ALL_KINDS] : [];
  }

  /** Community workers may receive their own districts only; everybody else any district. */
  private async visibleDistricts(manager: EntityManager, userId: string, role: Role): Promise<{ id: string; code: string; name: string }[]> {
    return role === 'worker'
      ? manager.query(`SELECT d.id, d.code, d.name FROM districts d JOIN user_districts ud ON ud.district_id = d.id WHERE ud.user_id = $1 ORDER BY d.code`, [userId])
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
