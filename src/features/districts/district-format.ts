import type { TFunction } from 'i18next';
import type { DistrictDto } from '../../../shared/api/districts.schema';
import type { Formatters } from '../../i18n/format';

/** The most recent year's population of a district, if any is recorded. */
export function latestPopulation(district: Pick<DistrictDto, 'populations'>) {
  let latest: { year: number; population: number } | undefined;
  for (const p of district.populations) if (!latest || p.year > latest.year) latest = p;
  return latest;
}

/** "82,500 (2024)" in the interface language's number format, or "Not recorded". */
export function formatLatestPopulation(district: Pick<DistrictDto, 'populations'>, t: TFunction, f: Formatters): string {
  const latest = latestPopulation(district);
  return latest ? t('population.latest', { population: f.number(latest.population), year: latest.year }) : t('population.notRecorded');
}

