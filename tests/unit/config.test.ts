import { describe, expect, it } from 'vitest';
import { checkNewPassword } from '../../server/auth/passwords';
import { parseConfig } from '../../server/config';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', JWT_SECRET: 'x'.repeat(40) };

describe('config', () => {
  it('when every value is good, then defaults fill the rest (bcrypt cost 12, port 5180)', () => {
    const c = parseConfig(base);
    expect(c.PORT).toBe(5180);
    expect(c.BCRYPT_COST).toBe(12);
  });

  it('when a value is bad or missing, then the error names it', () => {
    expect(() => parseConfig({ ...base, PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => parseConfig({ DATABASE_URL: base.DATABASE_URL })).toThrow(/JWT_SECRET/);
    expect(() => parseConfig({ ...base, DATABASE_URL: 'mysql://x' })).toThrow(/DATABASE_URL/);
    expect(() => parseConfig({ ...base, NODE_ENV: 'production' })).toThrow(/COOKIE_SECURE/);
  });
});

describe('password rules', () => {
  it('when production is asked to accept the demo password, then it refuses; development accepts it', () => {
    expect(() => checkNewPassword('broodcast-demo', 'production')).toThrow(/demo password/);
    expect(() => checkNewPassword('broodcast-demo', 'development')).not.toThrow();
  });
});
