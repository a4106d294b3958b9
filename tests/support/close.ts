import { expect } from 'vitest';

/**
 * Expect two floating-point numbers to agree within a relative tolerance (with a tiny absolute floor for
 * values at or near zero). Property tests use this rather than `toBeCloseTo`, whose tolerance is absolute
 * (5e-7 at 6 digits) and so fails on large generated values (3e8 differs in the 8th significant digit
 * after a different summation order): common practice for comparing floating-point results.
 */
export function expectClose(actual: number | null | undefined, expected: number | null | undefined, rel = 1e-9, abs = 1e-12): void {
  expect(actual, 'a number').toEqual(expect.any(Number));
  expect(expected, 'a number').toEqual(expect.any(Number));
  const a = actual as number;
  const e = expected as number;
  const allowed = Math.max(abs, rel * Math.max(Math.abs(a), Math.abs(e)));
  expect(Math.abs(a - e), `${a} vs ${e}: differs by more than ${allowed} (relative ${rel})`).toBeLessThanOrEqual(allowed);
}

/** `actual ≤ bound`, allowing a relative rounding slack. */
export function expectAtMost(actual: number, bound: number, rel = 1e-9, abs = 1e-12): void {
  const allowed = Math.max(abs, rel * Math.max(Math.abs(actual), Math.abs(bound)));
  expect(actual, `${actual} ≤ ${bound} (+${allowed})`).toBeLessThanOrEqual(bound + allowed);
}
