import { z } from 'zod';
import type { CliCommand } from '../command';
import { CUTOFFS, DEGREE_DAY_METHODS, degreeDays } from '../../shared/model/degree-days';
import { oneOf, temperature } from './options';

const input = z
  .strictObject({
    method: oneOf(DEGREE_DAY_METHODS),
    cutoff: oneOf(CUTOFFS).optional(),
    lower: temperature(),
    upper: temperature(),
    tmin: temperature(),
    tmax: temperature(),
    tminNext: temperature().optional(),
  })
  .superRefine((v, ctx) => {
    if (!(v.lower < v.upper)) ctx.addIssue({ code: 'custom', path: ['upper'], message: 'must be above the lower threshold' });
    if (v.tmin > v.tmax) ctx.addIssue({ code: 'custom', path: ['tmin'], message: 'must not be above tmax' });
  });

export const degreeDaysCommand: CliCommand<z.infer<typeof input>> = {
  name: 'degree-days',
  summary: 'Degree-days for one day (°C). Double methods use --tmin-next, or today\'s Tmin when it is absent.',
  input,
  run: (v) => {
    const r = degreeDays(v);
    return r.nextTminFallback ? { degreeDays: r.degreeDays, nextTminFallback: true } : { degreeDays: r.degreeDays };
  },
};
