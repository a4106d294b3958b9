import type { TFunction } from 'i18next';
import type { ProfileParameterDto } from '../../../shared/api/profiles.schema';
import type { Formatters } from '../../i18n/format';

/** The locale key of a parameter path ("development.lowerThreshold" → "development_lowerThreshold"). */
const keyOf = (path: string) => path.replace(/\./g, '_');

/** A parameter's name in the interface language; the path itself for a parameter without one (a variant's own). */
export function parameterName(t: TFunction<'profiles'>, path: string): string {
  return t(`param.${keyOf(path)}`, { defaultValue: path });
}

/** A parameter's unit in the interface language ('' without one). */
export function parameterUnit(t: TFunction<'profiles'>, unit: string | null): string {
  return unit ? t(`unit.${keyOf(unit)}`, { defaultValue: unit }) : '';
}

/** A parameter's value with its unit, numbers written as the interface language writes them. */
export function parameterValue(t: TFunction<'profiles'>, f: Formatters, p: Pick<ProfileParameterDto, 'value' | 'unit'>): string {
  const one = (x: string | number) => (typeof x === 'number' ? f.number(x, 4) : x);
  const v = Array.isArray(p.value) ? p.value.map(one).join(' ; ') : p.value === null ? '' : one(p.value);
  const unit = parameterUnit(t, p.unit);
  return unit ? `${v} ${unit}` : v;
}

/** The option a variant's parameter picker shows: "Lower development threshold (11.36 °C)". */
export function parameterOption(t: TFunction<'profiles'>, f: Formatters, p: Pick<ProfileParameterDto, 'path' | 'value' | 'unit'>): string {
  return `${parameterName(t, p.path)} (${parameterValue(t, f, p)})`;
}
