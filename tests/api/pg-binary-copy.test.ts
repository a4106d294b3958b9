import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BinaryCopyWriter } from '../../server/db/pg-binary-copy';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('the binary COPY writer', () => {
  it('when rows of uuid, text, int, date, real[] with unknowns and boolean[] are copied, then PostgreSQL reads back the same values', async () => {
    const runner = t.ds.createQueryRunner();
    await runner.connect();
    try {
      await runner.query(`CREATE TEMP TABLE copy_check (id uuid, name text, n int, d date, xs real[], flags boolean[])`);
      const w = new BinaryCopyWriter(16); // small on purpose: the buffer must grow
      const xs = new Float32Array([1.5, Number.NaN, -0.25, 3.4e38, 1e-40]);
      w.row(6).uuid('0b9f3c1e-5d2a-4c7b-9e8f-1a2b3c4d5e6f').text('Ville-Étoile ✓').int4(-7).date(20454) // 2026-01-01
        .float4Array(xs, 0, xs.length).boolArray(new Uint8Array([1, 0, 1]), 0, 3);
      w.row(6).uuid('00000000-0000-0000-0000-000000000001').text('').int4(0).date(0).float4Array(xs, 1, 0).boolArray(new Uint8Array(0), 0, 0);
      const client = (runner as unknown as { databaseConnection: pg.PoolClient }).databaseConnection;
      await pipeline(Readable.from([w.finish()]), client.query(copyFrom('COPY copy_check FROM STDIN (FORMAT binary)')));
      const rows = await runner.query(`SELECT id, name, n, to_char(d, 'YYYY-MM-DD') AS d, xs, flags, xs[2] IS NULL AS gap FROM copy_check ORDER BY n`);
      expect(rows[0]).toMatchObject({ id: '0b9f3c1e-5d2a-4c7b-9e8f-1a2b3c4d5e6f', name: 'Ville-Étoile ✓', n: -7, d: '2026-01-01', flags: [true, false, true], gap: true });
      expect(rows[0].xs.slice(0, 3)).toEqual([1.5, null, -0.25]);
      expect(rows[0].xs[3]).toBeCloseTo(3.4e38, -33);
      expect(rows[0].xs[4]).toBeCloseTo(0, 38); // below float4's normal range: a subnormal, not an error
      expect(rows[1]).toMatchObject({ name: '', n: 0, d: '1970-01-01', xs: [], flags: [] });
    } finally {
      await runner.release();
    }
  });
});
