import { EventEmitter } from 'node:events';
import { describe, expect, it, vi } from 'vitest';
import { installProcessGuards } from '../../server/platform/process-guards';

const setUp = () => {
  const proc = Object.assign(new EventEmitter(), { exitCode: undefined as number | string | undefined });
  const logger = { fatal: vi.fn() };
  const stop = vi.fn(async (_code: number) => undefined);
  installProcessGuards(proc as never, logger as never, stop);
  return { proc, logger, stop };
};

describe('process guards', () => {
  it('when a promise nobody awaited rejects, then the server logs it and stops cleanly with exit code 1', () => {
    const { proc, logger, stop } = setUp();
    proc.emit('unhandledRejection', new Error('database is behind'));
    expect(logger.fatal).toHaveBeenCalledTimes(1);
    expect(logger.fatal.mock.calls[0][0]).toMatchObject({ kind: 'unhandledRejection' });
    expect(stop).toHaveBeenCalledWith(1);
    expect(proc.exitCode).toBe(1);
  });

  it('when an exception nobody caught is thrown twice, then both are logged and the stop runs once', () => {
    const { proc, logger, stop } = setUp();
    proc.emit('uncaughtException', new Error('first'));
    proc.emit('uncaughtException', new Error('second'));
    proc.emit('unhandledRejection', 'a plain string');
    expect(logger.fatal).toHaveBeenCalledTimes(3);
    expect(logger.fatal.mock.calls[2][0]).toMatchObject({ reason: 'a plain string' });
    expect(stop).toHaveBeenCalledTimes(1);
  });
});
