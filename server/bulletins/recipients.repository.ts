import type { EntityManager } from 'typeorm';
import type { MailKind } from '../../shared/api/bulletins.schema';
import type { Role } from '../../shared/roles';
import type { Language } from '../../shared/api/auth.schema';

/** Who a subscription mail goes to. */
export interface Recipient {
  userId: string;
  email: string;
  displayName: string;
  /** The language their mail is written in (user preference). */
  language: Language;
  /** Their role, which sets how their weekly digest is laid out. */
  role: Role;
}

/** One district and one person who receives its mail. */
export interface DistrictRecipient extends Recipient {
  districtId: string;
}

/** Whether user `u` is assigned district `d`: one of their own districts, or a district of one of their regions (issue 17). */
const assignedSql = (d: string) => `(EXISTS (SELECT 1 FROM user_districts ud WHERE ud.user_id = u.id AND ud.district_id = ${d})
   OR EXISTS (SELECT 1 FROM user_regions ur JOIN districts rd ON rd.region_id = ur.region_id WHERE ur.user_id = u.id AND rd.id = ${d}))`;

/**
 * The role defaults of docs/product.md § Roles for a user who has chosen nothing yet: health officers and
 * supervisors receive every district (or, when scoped to regions, the districts of their regions and their
 * own), epidemiologists and community workers their assigned ones (own districts and those of their
 * regions), and admins nothing (they subscribe on the preferences page).
 */
const defaultSql = (d: string) => `((u.role IN ('officer', 'supervisor') AND (NOT EXISTS (SELECT 1 FROM user_regions ur WHERE ur.user_id = u.id) OR ${assignedSql(d)}))
   OR (u.role IN ('epidemiologist', 'worker') AND ${assignedSql(d)}))`;

/**
 * Whether user `u` receives mail of kind `kind` for district `d` now: an active account whose invitation
 * was accepted (a password is set) — an address nobody has confirmed gets nothing but its invitation —
 * and either their own choice or, when they chose nothing, their role's default.
 */
const receivesSql = (d: string, kind: string) => `u.active AND u.password_hash IS NOT NULL
        AND CASE WHEN EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = u.id)
                 THEN EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = u.id AND s.district_id = ${d} AND s.active AND ${kind} = ANY (s.kinds))
                      -- a community worker's rows count only for a district they are (still) assigned to
                      AND (u.role <> 'worker' OR ${assignedSql(d)})
                 ELSE ${defaultSql(d)} END`;

const RECIPIENT_COLUMNS = `u.id AS "userId", u.email, u.display_name AS "displayName", u.language, u.role`;

/** Who receives `kind` for a district now, in the caller's transaction, by e-mail address. */
export async function recipientsOf(manager: EntityManager, districtId: string, kind: MailKind): Promise<Recipient[]> {
  return manager.query(
    `SELECT ${RECIPIENT_COLUMNS} FROM users u WHERE ${receivesSql('$1', '$2')} ORDER BY u.email`,
    [districtId, kind],
  );
}

/**
 * The same rule as `recipientsOf` for many districts in ONE query (issue 21: the digest preview asked once
 * per district). Rows come district by district in the order given, each district's people by e-mail
 * address, exactly as calling `recipientsOf` district after district would give them. With `onlyUserId`,
 * only that person's rows: the districts whose mail they receive.
 */
export async function recipientsOfDistricts(
  manager: EntityManager, districtIds: string[], kind: MailKind, onlyUserId?: string,
): Promise<DistrictRecipient[]> {
  if (districtIds.length === 0) return [];
  return manager.query(
    `SELECT dd.id AS "districtId", ${RECIPIENT_COLUMNS}
       FROM unnest($1::uuid[]) WITH ORDINALITY AS dd(id, ord)
       JOIN users u ON ${receivesSql('dd.id', '$2')}
      WHERE ($3::uuid IS NULL OR u.id = $3::uuid)
      ORDER BY dd.ord, u.email`,
    [districtIds, kind, onlyUserId ?? null],
  );
}
