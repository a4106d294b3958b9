import pg from 'pg';

/**
 * A fresh copy of the migrated template database for the calling test file, so row counts before
 * and after an action see only that file's writes. Named per vitest worker; dropped and re-made per file.
 */
export async function freshTestDatabase(): Promise<string> {
  const template = process.env.TEST_TEMPLATE_DATABASE_URL;
  if (!template) throw new Error('TEST_TEMPLATE_DATABASE_URL is not set: run the tests with `npm test`.');
  const url = new URL(template);
  const templateName = url.pathname.slice(1);
  const name = `${templateName}_w${process.env.VITEST_POOL_ID ?? process.env.VITEST_WORKER_ID ?? '0'}`;
  url.pathname = '/postgres';
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  try {
    // A backend of the previous file may still be closing: try again briefly before giving up.
    for (let attempt = 1; ; attempt++) {
      try {
        await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
        break;
      } catch (err) {
        if (attempt >= 5) throw err;
        await new Promise((r) => setTimeout(r, 300 * attempt));
      }
    }
    await client.query(`CREATE DATABASE "${name}" TEMPLATE "${templateName}"`);
  } finally {
    await client.end();
  }
  url.pathname = `/${name}`;
  return url.toString();
}
