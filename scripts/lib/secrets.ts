import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface LocalSecrets {
  databasePassword: string;
  jwtSecret: string;
}

/** Secrets generated once per installation into the git-ignored `.local/` folder (mode 600). */
export function loadLocalSecrets(projectDir: string, name: string): LocalSecrets {
  const dir = path.join(projectDir, '.local');
  const file = path.join(dir, `secrets.${name}.json`);
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as LocalSecrets;
  mkdirSync(dir, { recursive: true });
  const secrets: LocalSecrets = {
    databasePassword: randomBytes(18).toString('base64url'),
    jwtSecret: randomBytes(48).toString('base64url'),
  };
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  return secrets;
}
