import { z } from 'zod';
import { isIsoDate } from '../../shared/model/dates';

/** Option schemas with messages that read well after the option's name ("--tmin: expected …"). */

export const required = (what: string) => (iss: { input: unknown }) => (iss.input === undefined ? 'is required' : `expected ${what}`);

/** A finite number (°C, degrees…). */
export const finiteNumber = (what = 'a number') => z.number({ error: required(what) });

export const temperature = () => finiteNumber('a temperature in °C');

export const latitude = () =>
  finiteNumber('a latitude in degrees (−90…90)').min(-90, 'expected a latitude in degrees (−90…90)').max(90, 'expected a latitude in degrees (−90…90)');

export const isoDate = () => z.string({ error: required('a date YYYY-MM-DD') }).refine(isIsoDate, 'expected a date YYYY-MM-DD');

export const oneOf = <T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, { error: required(`one of ${values.join(', ')}`) });
