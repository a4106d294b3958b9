import bcrypt from 'bcryptjs';
import { badRequest } from '../http/errors';
import { COMMON_PASSWORDS } from './common-passwords';

export const DEMO_PASSWORD = 'broodcast-demo';

/** Server-side password rules on top of the shared length rule. */
export function checkNewPassword(password: string, nodeEnv: string): void {
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
}

export const hashPassword = (password: string, cost: number) => bcrypt.hash(password, cost);
export const verifyPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

/** A hash to compare against when the account does not exist, so both answers take the same time. */
let dummyHash: string | null = null;
export async function verifyAgainstDummy(password: string, cost: number): Promise<void> {
  dummyHash ??= await bcrypt.hash('no-such-account-placeholder', cost);
  await bcrypt.compare(password, dummyHash);
}
