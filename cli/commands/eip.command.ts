import { z } from 'zod';
import type { CliCommand } from '../command';
import { getProfile, PROFILE_IDS } from '../../shared/model/profiles';
import { compileProfile, eipDays } from '../../shared/model/traits';
import { oneOf, temperature } from './options';

const input = z.strictObject({ profile: oneOf(PROFILE_IDS as [string, ...string[]]), temp: temperature() });

export const eipCommand: CliCommand<z.infer<typeof input>> = {
  name: 'eip',
  summary: 'Extrinsic incubation period in days at a constant temperature (null where the pathogen does not develop).',
  input,
  run: (v) => {
    const p = getProfile(v.profile);
    const days = eipDays(p, v.temp);
    if (!compileProfile(p).hasRanges) return { days };
    // The slow end of the profile's ranges gives the longer incubation.
    const slow = eipDays(p, v.temp, 'slow');
    const fast = eipDays(p, v.temp, 'fast');
    return slow === days && fast === days ? { days } : { days, low: fast, high: slow };
  },
};
