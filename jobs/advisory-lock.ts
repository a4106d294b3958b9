/**
 * Kept for the callers not yet moved (bulletins, season run, scheduler, tests): the locks live in
 * server/platform/locks.ts, with one key scheme.
 */
export { lockKey, withAdvisoryLock } from '../server/platform/locks';
