import type { DataSource } from 'typeorm';
import { email as emailSchema } from '../../shared/api/common.schema';
import { recordAudit } from '../audit/audit.repository';
import { inviteLink } from '../auth/auth.mails';
import { issueToken } from '../auth/tokens.repository';
import { UserEntity } from '../users/user.entity';
import { transactionLock } from '../platform/locks';
import { SetupRepository } from './setup.repository';

/** How long the first admin's link stays usable (the same as an invitation's). */
export const FIRST_ADMIN_TTL_HOURS = 72;
/** The first admin's e-mail when `BROODCAST_ADMIN_EMAIL` is not set (a reserved name: change it by setting the variable). */
export const DEFAULT_FIRST_ADMIN_EMAIL = 'admin@broodcast.example';

/**
 * An installation started without the demo has no one to sign in. While no admin has a password yet, this
 * makes sure there is a pending admin account and gives a fresh one-time link to choose its password — the
 * invitation's own link and token (`/invite/accept`), so accepting it is the ordinary invite acceptance.
 * An earlier unused link of that account stops working (only the newest printed link is live). Returns null
 * once an admin can sign in: the link is never printed again.
 */
export async function firstAdminLink(ds: DataSource, opts: { appUrl: string; email?: string }): Promise<{ link: string; email: string } | null> {
  const parsed = emailSchema.safeParse((opts.email ?? DEFAULT_FIRST_ADMIN_EMAIL).trim());
  if (!parsed.success) throw new Error(`BROODCAST_ADMIN_EMAIL is not an e-mail address: ${opts.email}`);
  const email = parsed.data.toLowerCase();
  return ds.transaction(async (manager) => {
    // One start at a time decides (two starts on one database would otherwise both create the account).
    await transactionLock(manager, 'first-admin');
    const setup = new SetupRepository(manager);
    if (await setup.anAdminCanSignIn()) return null;
    let user = await manager.findOneBy(UserEntity, { email });
    if (!user) {
      user = await manager.save(UserEntity, { email, displayName: 'Administrator', role: 'admin', passwordHash: null, active: true });
      await recordAudit(manager, {
        actorId: null, action: 'user.invited', entity: 'user', entityId: user.id,
        after: { email, role: 'admin' }, reason: 'first admin of an installation started without the demo',
      });
    } else if (user.role !== 'admin' || !user.active) {
      await manager.update(UserEntity, { id: user.id }, { role: 'admin', active: true });
    }
    await setup.retireInviteLinks(user.id);
    const token = await issueToken(manager, user.id, 'invite', FIRST_ADMIN_TTL_HOURS);
    return { link: inviteLink(opts.appUrl, token, 'en'), email };
  });
}
