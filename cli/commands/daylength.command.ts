import { z } from 'zod';
import type { CliCommand } from '../command';
import { dayLength, DAY_LENGTH_DEFINITIONS, type DayLengthDefinition } from '../../shared/model/day-length';
import { isoDate, latitude, oneOf } from './options';

const DEFINITIONS = Object.keys(DAY_LENGTH_DEFINITIONS) as [DayLengthDefinition, ...DayLengthDefinition[]];

const input = z.strictObject({
  lat: latitude(),
  date: isoDate(),
  definition: oneOf(DEFINITIONS).optional(),
});

export const dayLengthCommand: CliCommand<z.infer<typeof input>> = {
  name: 'daylength',
  summary: 'Day length in hours (Forsythe et al. 1995 CBM model); --definition sunrise (default) or civil.',
  input,
  run: (v) => ({ hours: dayLength(v.lat, v.date, { definition: v.definition ?? 'sunrise' }) }),
};
