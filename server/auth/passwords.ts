import bcrypt from 'bcryptjs';
import { badRequest } from '../http/errors';
import { COMMON_PASSWORDS, isContextWordPassword } from './common-passwords';

export const DEMO_PASSWORD = 'broodcast-demo';

/**
 * Server-side password rules on top of the shared length rule (10 to 200 characters, any characters,
 * no composition rules, checked exactly as typed): not the demo password in production, not on the
 * common-password list, not only a word of the service, and not built on the user's own e-mail name.
 */
export function checkNewPassword(password: string, nodeEnv: string, user?: { email: string }): void {
  if (nodeEnv === 'production' && password === DEMO_PASSWORD) {
    throw badRequest('password_rejected', 'The demo password cannot be used here.', [
      { path: 'password', message: 'is the demo password, which production refuses' },
    ]);
  }
  if (COMMON_PASSWORDS.has(password.toLowerCase())) {
    throw badRequest('password_rejected', 'That password is too common.', [
      { path: 'password', message: 'is on the list of common passwords; choose another' },
    ]);
  }
  if (isContextWordPassword(password)) {
    throw badRequest('password_rejected', 'That password is too easy to guess here.', [
      { path: 'password', message: 'is only a word of this service with digits or symbols; choose another' },
    ]);
  }
  const name = user?.email.split('@')[0]?.toLowerCase().replace(/[^a-z0-9]/g, '') ?? '';
  if (name.length >= 4 && password.toLowerCase().replace(/[^a-z0-9]/g, '').includes(name)) {
    throw badRequest('password_rejected', 'That password contains your e-mail name.', [
      { path: 'password', message: 'contains the name of your e-mail address; choose another' },
    ]);
  }
}

export const hashPassword = (password: string, cost: number) => bcrypt.hash(password, cost);
export const verifyPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/** A hash to compare against when the account does not exist, so both answers take the same time. */
let dummyHash: string | null = null;
export async function verifyAgainstDummy(password: string, cost: number): Promise<void> {
  dummyHash ??= await bcrypt.hash('no-such-account-placeholder', cost);
  await bcrypt.compare(password, dummyHash);
}
