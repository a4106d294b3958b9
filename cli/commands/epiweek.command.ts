import { z } from 'zod';
import type { CliCommand } from '../command';
import { epiWeek, EPI_WEEK_SYSTEMS } from '../../shared/model/epi-week';
import { isoDate, oneOf } from './options';

const input = z.strictObject({ date: isoDate(), system: oneOf(EPI_WEEK_SYSTEMS) });

export const epiWeekCommand: CliCommand<z.infer<typeof input>> = {
  name: 'epiweek',
  summary: 'Epidemiological week of a date: mmwr (Sunday start) or iso (Monday start).',
  input,
  run: (v) => epiWeek(v.date, v.system),
};
