import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLocalSecrets } from '../../scripts/lib/secrets';
import { parseConfig } from '../../server/config';

/**
 * Secrets (OWASP ASVS 5.0 V13.3.1, V11.3): nothing that looks like a secret is in the repository, and
 * each installation generates its own JWT secret when none is given. Reads git's file list only.
 */
const root = path.resolve(import.meta.dirname, '../..');

/** Files git tracks, plus new ones not ignored (they are about to be committed). */
function repositoryFiles(): string[] {
  const out = execFileSync('git', ['ls-files', '-z', '--cached', '--others', '--exclude-standard'], { cwd: root, encoding: 'utf8' });
  return [...new Set(out.split('\0').filter(Boolean))].filter((f) => existsSync(path.join(root, f)) && statSync(path.join(root, f)).isFile());
}

const PATTERNS: [string, RegExp][] = [
  ['a private key', /-----BEGIN [A-Z ]*PRIVATE KEY-----/],
  ['a JWT', /eyJ[A-Za-z0-9_-]{10,}\.eyJ[A-Za-z0-9_-]{10,}\.[A-Za-z0-9_-]{10,}/],
  ['a cloud access key', /\b(AKIA|ASIA)[0-9A-Z]{16}\b/],
  ['a password or secret set to a quoted literal', /\b[A-Z_]*(PASSWORD|SECRET|API_KEY|TOKEN|FEED_KEY|PRIVATE_KEY)\b['"]?\s*[:=]\s*['"][^'"$\s]{8,}['"]/],
  ['a password or secret set in a shell or env line', /^\s*(export\s+)?[A-Z_]*(PASSWORD|SECRET|TOKEN|_KEY)=[^\s$'"{(]{8,}/],
  ['a connection string with a password', /postgres(ql)?:\/\/[^:/\s'"]+:[^@\s'"$]{6,}@/],
];

/** Literal values that are not secrets, each with its reason. */
const ALLOWED: [RegExp, string][] = [
  [/DEMO_PASSWORD = 'broodcast-demo'/, 'the published demo credential (README), refused when NODE_ENV=production'],
  [/TEST_PASSWORD = 'a-test-password-42'/, 'the password of factory users in the throw-away test database'],
  [/TEST_JWT_SECRET = 'test-secret-that-is-long-enough-for-hs256-signing'/, 'signs sessions of in-process test apps only'],
  [/JWT_SECRET: 'bench-secret-that-is-long-enough-for-signing'/, 'the benchmark server on its own throw-away database'],
  [/postgres:\/\/nobody:x@127\.0\.0\.1:9\//, 'a closed port used to simulate a database outage'],
  [/^\s*const PASSWORD = '[a-z]+-password-42';/, 'the user of a benchmark or drill (bench/), on its own throw-away database'],
];

describe('secrets', () => {
  it('when every file of the repository is scanned, then none holds a private key, a JWT, a cloud key or a literal password or secret (the demo and test fixtures aside)', () => {
    const files = repositoryFiles();
    expect(files.length).toBeGreaterThan(100);
    const tracked = execFileSync('git', ['ls-files', '-z'], { cwd: root, encoding: 'utf8' }).split('\0');
    expect(tracked.filter((f) => f.startsWith('.local/') || /(^|\/)\.env(\.|$)/.test(f) || /\.(pem|key|p12)$/.test(f))).toEqual([]);
    const findings: string[] = [];
    for (const file of files) {
      if (/^(package-lock\.json|public\/.*\.(png|ico|woff2?))$/.test(file)) continue;
      const text = readFileSync(path.join(root, file), 'utf8');
      if (text.includes('\0')) continue; // binary
      text.split('\n').forEach((line, i) => {
        for (const [what, re] of PATTERNS) {
          if (!re.test(line)) continue;
          if (file === 'tests/api/security-secrets.test.ts') continue;
          if (ALLOWED.some(([ok]) => ok.test(line)) && (!/PASSWORD = '[a-z]+-password-42'/.test(line) || file.startsWith('bench/'))) continue;
          findings.push(`${file}:${i + 1}: ${what}`);
        }
      });
    }
    expect(findings).toEqual([]);
    console.log(`[security] repository files scanned for secrets: ${files.length}; findings: ${findings.length}`);
  });

  const dirs: string[] = [];
  afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

  it('when an installation has no secrets yet, then it generates its own JWT secret (64 characters, mode 600, git-ignored) that the config accepts and keeps', () => {
    const one = mkdtempSync(path.join(os.tmpdir(), 'broodcast-install-'));
    const two = mkdtempSync(path.join(os.tmpdir(), 'broodcast-install-'));
    dirs.push(one, two);
    const first = loadLocalSecrets(one, 'dev');
    expect(first.jwtSecret).toMatch(/^[A-Za-z0-9_-]{64}$/);
    expect(loadLocalSecrets(one, 'dev').jwtSecret).toBe(first.jwtSecret);
    expect(loadLocalSecrets(two, 'dev').jwtSecret).not.toBe(first.jwtSecret);
    expect(statSync(path.join(one, '.local', 'secrets.dev.json')).mode & 0o777).toBe(0o600);
    const config = parseConfig({ DATABASE_URL: 'postgres://u@127.0.0.1:1/db', JWT_SECRET: first.jwtSecret });
    expect(config.JWT_SECRET).toBe(first.jwtSecret);
    // Without a secret (or with a short one) the server does not start, naming the setting.
    expect(() => parseConfig({ DATABASE_URL: 'postgres://u@127.0.0.1:1/db' })).toThrow(/JWT_SECRET/);
    expect(() => parseConfig({ DATABASE_URL: 'postgres://u@127.0.0.1:1/db', JWT_SECRET: 'short' })).toThrow(/JWT_SECRET/);
    // npm start passes the generated secret when JWT_SECRET is not set, and .local/ stays out of git.
    expect(readFileSync(path.join(root, 'scripts/start.ts'), 'utf8')).toMatch(/JWT_SECRET: process\.env\.JWT_SECRET \?\? (\w+\.)?secrets\.jwtSecret/);
    expect(execFileSync('git', ['check-ignore', '.local/secrets.dev.json'], { cwd: root, encoding: 'utf8' }).trim()).toBe('.local/secrets.dev.json');
  });
});
