import jwt from 'jsonwebtoken';
import type { SignInBody } from '../../shared/api/auth.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { badRequest, unauthorized } from '../http/errors';
import { UserEntity } from '../users/user.entity';
import { UsersRepository } from '../users/users.repository';
import { checkNewPassword, hashPassword, verifyAgainstDummy, verifyPassword } from './passwords';
import type { Principal } from './principal';
import { SessionsRepository } from './sessions.repository';
import { consumeToken, newToken } from './tokens.repository';
import { recordResetRequest } from './reset-requests.repository';
import { DEFAULT_LANGUAGE } from '../i18n';
import type { TokenPurpose } from './one-time-token.entity';
import { passwordResetMail, resetLink } from './auth.mails';
import { sessionCookieName } from './session.middleware';

const JWT_ISSUER = 'broodcast';
const RESET_TTL_HOURS = 1;

interface SessionClaims {
  sid: string;
  sub: string;
}

export class AuthService {
  private readonly sessions: SessionsRepository;
  private readonly users: UsersRepository;

  /** The session cookie's name: `__Host-` prefixed when cookies are Secure (ASVS V3.3.1, V3.3.3). */
  readonly cookieName: string;

  constructor(private readonly ctx: AppContext) {
    this.sessions = new SessionsRepository(ctx.ds);
    this.users = new UsersRepository(ctx.ds);
    this.cookieName = sessionCookieName(ctx.config);
  }

  /** Check the e-mail and password; a failure never says which part was wrong. */
  async signIn(body: SignInBody): Promise<{ token: string; expiresAt: Date; userId: string }> {
    const user = await this.users.findByEmail(body.email);
    if (!user || !user.active || !user.passwordHash) {
      await verifyAgainstDummy(body.password, this.ctx.config.BCRYPT_COST);
      // Security event without the e-mail address: the user id when the account exists.
      this.ctx.logger.info({ event: 'auth.sign-in-failed', reason: !user ? 'unknown-account' : !user.active ? 'inactive' : 'no-password', user: user?.id ?? null }, 'sign-in failed');
      throw unauthorized('The e-mail or password is not right.');
    }
    if (!(await verifyPassword(body.password, user.passwordHash))) {
      this.ctx.logger.info({ event: 'auth.sign-in-failed', reason: 'wrong-password', user: user.id }, 'sign-in failed');
      throw unauthorized('The e-mail or password is not right.');
    }
    const expiresAt = new Date(Date.now() + this.ctx.config.SESSION_TTL_HOURS * 3_600_000);
    const session = await this.sessions.create(user.id, expiresAt);
    const token = jwt.sign({ sid: session.id }, this.ctx.config.JWT_SECRET, {
      subject: user.id,
      issuer: JWT_ISSUER,
      algorithm: 'HS256',
      expiresIn: Math.floor(this.ctx.config.SESSION_TTL_HOURS * 3600),
    });
    this.ctx.logger.info({ event: 'auth.sign-in', user: user.id, role: user.role, session: session.id }, 'signed in');
    return { token, expiresAt, userId: user.id };
  }

  async signOut(token: string | undefined, event = 'auth.sign-out'): Promise<void> {
    const claims = token ? this.verify(token) : null;
    if (claims) {
      await this.sessions.revoke(claims.sid);
      this.ctx.logger.info({ event, user: claims.sub, session: claims.sid }, 'session ended');
    }
  }

  /** The principal behind a session cookie, or null (bad signature, expired, revoked, deactivated). */
  async principalFromToken(token: string): Promise<Principal | null> {
    const claims = this.verify(token);
    if (!claims) return null;
    return this.sessions.findPrincipal(claims.sid, claims.sub);
  }

  private verify(token: string): SessionClaims | null {
    try {
      const claims = jwt.verify(token, this.ctx.config.JWT_SECRET, { issuer: JWT_ISSUER, algorithms: ['HS256'] });
      if (typeof claims === 'string' || typeof claims.sid !== 'string' || typeof claims.sub !== 'string') return null;
      return { sid: claims.sid, sub: claims.sub };
    } catch {
      return null;
    }
  }

  /**
   * Always answers the same way and does the same work, whether or not the account exists (no account
   * enumeration by answer or by time): one lookup, one token made and hashed, one mail written, one
   * statement in one transaction that puts the token and the mail in the outbox — or, for an address
   * with no usable account, inserts nothing. The outbox worker sends the mail (and retries while the
   * mail server is down); nothing is sent inside the request.
   */
  async requestPasswordReset(email: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    const account = user && user.active && user.passwordHash ? user : null;
    const { token, tokenHash } = newToken();
    const link = resetLink(this.ctx.config.APP_URL, token, account?.language ?? DEFAULT_LANGUAGE);
    const mail = passwordResetMail(account?.displayName ?? email, link, RESET_TTL_HOURS, account?.language ?? DEFAULT_LANGUAGE);
    const written = await this.ctx.ds.transaction((manager) =>
      recordResetRequest(manager, this.ctx.config, { userId: account?.id ?? null, to: account?.email ?? email, tokenHash, ttlHours: RESET_TTL_HOURS, mail }),
    );
    if (written > 0) this.ctx.logger.info({ event: 'auth.password-reset-requested', user: account!.id }, 'password reset link queued');
  }

  confirmPasswordReset(token: string, password: string) {
    return this.setPasswordWithToken(token, password, 'password-reset');
  }

  acceptInvite(token: string, password: string) {
    return this.setPasswordWithToken(token, password, 'invite');
  }

  private async setPasswordWithToken(token: string, password: string, purpose: TokenPurpose): Promise<void> {
    checkNewPassword(password, this.ctx.config.NODE_ENV);
    const hash = await hashPassword(password, this.ctx.config.BCRYPT_COST);
    await this.ctx.ds.transaction(async (manager) => {
      const row = await consumeToken(manager, token, purpose);
      if (!row) {
        this.ctx.logger.info({ event: 'auth.token-refused', purpose }, 'one-time link refused');
        throw badRequest('token_invalid', 'This link has expired or was already used. Ask for a new one.', [
          { path: 'token', message: 'has expired or was already used' },
        ]);
      }
      // The user's own e-mail name may not be the password (the transaction rolls back: the link stays usable).
      const owner = await manager.findOneBy(UserEntity, { id: row.userId });
      if (owner) checkNewPassword(password, this.ctx.config.NODE_ENV, owner);
      await manager.update(UserEntity, { id: row.userId }, { passwordHash: hash });
      await this.sessions.revokeAllOf(manager, row.userId);
      await recordAudit(manager, {
        actorId: row.userId,
        action: purpose === 'invite' ? 'user.invite-accepted' : 'user.password-reset',
        entity: 'user',
        entityId: row.userId,
      });
      this.ctx.logger.info({ event: purpose === 'invite' ? 'auth.invite-accepted' : 'auth.password-reset', user: row.userId }, 'password set; other sessions ended');
    });
  }
}
