import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { parseRows } from '../platform/rows';

/** The SQL a district's edits share: forgetting its season-run state, and its neighbours' centroids. */
export class DistrictRunStateRepository {
  constructor(private readonly manager: EntityManager) {}

  /** The next season run recomputes these districts (their sources changed). */
  async clear(districtIds: string[]): Promise<void> {
    await this.manager.query('DELETE FROM district_run_state WHERE district_id = ANY($1::uuid[])', [districtIds]);
  }

  /** Every other district with a boundary and a centroid, as references for a boundary's plausibility. */
  async otherCentroids(districtId: string): Promise<{ code: string; lat: number; lon: number }[]> {
    return parseRows(z.object({ code: z.string(), lat: z.number(), lon: z.number() }), await this.manager.query(
      `SELECT code, centroid_lat AS lat, centroid_lon AS lon FROM districts
        WHERE id <> $1 AND boundary IS NOT NULL AND centroid_lat IS NOT NULL AND centroid_lon IS NOT NULL`,
      [districtId],
    ));
  }
}
