import type { DistrictDto } from '../../../shared/api/districts.schema';

/** The most recent year's population of a district, if any is recorded. */
export function latestPopulation(district: Pick<DistrictDto, 'populations'>) {
  let latest: { year: number; population: number } | undefined;
  for (const p of district.populations) if (!latest || p.year > latest.year) latest = p;
  return latest;
}

const numberFormat = new Intl.NumberFormat('en');

export function formatLatestPopulation(district: Pick<DistrictDto, 'populations'>): string {
  const latest = latestPopulation(district);
  return latest ? `${numberFormat.format(latest.population)} (${latest.year})` : 'Not recorded';
}

