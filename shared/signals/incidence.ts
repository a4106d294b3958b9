import { incidenceInputSchema } from './schemas';

/**
 * Incidence per 100,000 population: count / population · 100,000. Null for a population of zero
 * (no rate exists). The count may be a week's cases or a season's total; the rate is over the same
 * period.
 */
export function incidencePer100k(count: number, population: number): number | null {
  const p = incidenceInputSchema.parse({ count, population });
  return p.population === 0 ? null : (p.count / p.population) * 100_000;
}
