import { z } from 'zod';
import { isCalendarDate } from '../../shared/api/date.schema';

/** Option schemas with messages that read well after the option's name ("--tmin: expected …"). */

export const required = (what: string) => (iss: { input: unknown }) => (iss.input === undefined ? 'is required' : `expected ${what}`);

/** A finite number (°C, degrees…). */
export const finiteNumber = (what = 'a number') => z.number({ error: required(what) });

export const temperature = () => finiteNumber('a temperature in °C');

export const latitude = () =>
  finiteNumber('a latitude in degrees (−90…90)').min(-90, 'expected a latitude in degrees (−90…90)').max(90, 'expected a latitude in degrees (−90…90)');

/** The shared date type (shared/api/date.schema.ts): a real date YYYY-MM-DD, years 1900–2100. */
export const isoDate = () =>
  z.string({ error: required('a date YYYY-MM-DD') }).refine((d) => isCalendarDate(d), 'expected a date YYYY-MM-DD from 1900 to 2100');

export const oneOf = <T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, { error: required(`one of ${values.join(', ')}`) });
