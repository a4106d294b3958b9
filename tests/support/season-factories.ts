import type { DataSource } from 'typeorm';
import { makeDistrict, square } from './factories';

/**
 * A district with one profile and a year of smooth invented weather (warm in mid-year), written
 * straight into the district series table with generate_series.
 */
export async function makeSeasonDistrict(
  ds: DataSource,
  opts: { lat?: number; profileId?: string; from?: string; to?: string; warmth?: number } = {},
) {
  const lat = opts.lat ?? 20;
  const district = await makeDistrict(ds, { boundary: square(40, lat - 0.5), centroidLat: lat, centroidLon: 40.5 });
  await ds.query('INSERT INTO district_profiles (district_id, profile_id, biofix) VALUES ($1, $2, NULL)', [
    district.id, opts.profileId ?? 'aedes-aegypti-dengue',
  ]);
  await ds.query(
    `INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
     SELECT $1, d::date,
            18 + $4 + 6 * sin(2 * pi() * (extract(doy FROM d) - 110) / 365),
            28 + $4 + 6 * sin(2 * pi() * (extract(doy FROM d) - 110) / 365),
            70, 2, false, 1
       FROM generate_series($2::date, $3::date, interval '1 day') AS d`,
    [district.id, opts.from ?? '2025-01-01', opts.to ?? '2026-08-31', opts.warmth ?? 0],
  );
  return district;
}

/** A disease with weekly counts: `base` cases every week of the prior years, `current` this year's weeks. */
export async function makeCaseHistory(ds: DataSource, districtId: string, opts: { base: number; current: number[]; year: number }) {
  const code = `D${Math.random().toString(36).slice(2, 8).toUpperCase()}`;
  const [disease] = await ds.query(`INSERT INTO diseases (code, name, profile_ids) VALUES ($1, $2, '{}') RETURNING id`, [code, `Disease ${code}`]);
  for (let y = opts.year - 6; y < opts.year; y++) {
    await ds.query(
      `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at)
       SELECT $1, $2, $3, w, $4 + (w % 3), now(), now() FROM generate_series(1, 52) AS w`,
      [districtId, disease.id, y, opts.base],
    );
  }
  for (const [i, n] of opts.current.entries()) {
    await ds.query(
      `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at) VALUES ($1, $2, $3, $4, $5, now(), now())`,
      [districtId, disease.id, opts.year, i + 1, n],
    );
  }
  return disease.id as string;
}
