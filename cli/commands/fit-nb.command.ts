import { z } from 'zod';
import type { CliCommand } from '../command';
import { fitNegativeBinomial } from '../../shared/stats/negative-binomial';

// `fit-nb`: negative binomial regression (NB2, log link) as R's MASS::glm.nb; model and sources in
// docs/outlook.md ("Negative binomial fit"). Meant for --batch (one data set per JSON line); on the
// command line --y, --x and --offset take JSON arrays.

const json = (what: string, schema: z.ZodType) =>
  z.preprocess((v) => {
    if (typeof v !== 'string') return v;
    try {
      return JSON.parse(v);
    } catch {
      return v;
    }
  }, schema.refine(() => true, { message: `expected ${what}` }));

const count = z.number({ error: 'expected a non-negative integer count' }).int('expected a non-negative integer count').min(0, 'expected a non-negative integer count');
const finite = z.number({ error: 'expected a finite number' });

const input = z.strictObject({
  y: json('a JSON array of counts', z.array(count, { error: (iss) => (iss.input === undefined ? 'is required' : 'expected an array of counts') }).min(1, 'expected at least one count')),
  x: json(
    'a JSON array of covariate rows',
    z.array(z.array(finite, { error: 'expected each row to be an array of numbers' }), { error: (iss) => (iss.input === undefined ? 'is required' : 'expected an array of rows (arrays of numbers, no intercept column)') }),
  ),
  offset: json('a JSON array of log offsets', z.array(finite, { error: 'expected an array of log offsets' })).optional(),
});

type Input = { y: number[]; x: number[][]; offset?: number[] };

export const fitNbCommand: CliCommand<Input> = {
  name: 'fit-nb',
  summary: 'Negative binomial regression (NB2, log link, as MASS glm.nb): {coefficients (intercept first), standardErrors, theta, thetaStandardError, logLik, iterations, converged}',
  input: input as unknown as z.ZodType<Input>,
  run: (v) => {
    // Fitting errors (lengths, collinear covariates, all-zero counts) are RangeErrors naming the field.
    const f = fitNegativeBinomial(v);
    return {
      coefficients: f.coefficients,
      standardErrors: f.standardErrors,
      theta: f.theta,
      thetaStandardError: Number.isFinite(f.thetaStandardError) ? f.thetaStandardError : null,
      logLik: f.logLik,
      iterations: f.iterations,
      converged: f.converged,
    };
  },
};
