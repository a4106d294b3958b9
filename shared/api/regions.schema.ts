import { z } from 'zod';
import { uuid } from './common.schema';

/** `GET /api/regions`: the regions (one level above the district) with how many districts each holds. */
export const regionDto = z.object({
  id: uuid,
  code: z.string(),
  name: z.string(),
  districtCount: z.number().int(),
});
export type RegionDto = z.infer<typeof regionDto>;
export const regionsResponse = z.object({ regions: z.array(regionDto) });
export type RegionsResponse = z.infer<typeof regionsResponse>;
