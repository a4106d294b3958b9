import { z } from 'zod';

/**
 * Why one district, message or row could not be handled by a region-wide job: a stable code with
 * parameters (never an English sentence or a raw validation dump). Each language renders it in one place
 * (the client's `problemReasonText`). Codes: `invalid_value` {fields}, `unknown_profile` {profileId},
 * `database_error` {sqlState}, `render_failed` {}, `unexpected_error` {kind}, or an HTTP error's code.
 */
export const problemParams = z.record(z.string(), z.union([z.string(), z.number(), z.null()]));
export const problemReason = z.object({ code: z.string(), params: problemParams.optional() });
export type ProblemReason = z.infer<typeof problemReason>;

/**
 * A warning recorded on a season run. `district_failed` names the district and its `reason`; the other
 * codes (`no_profiles`, `missing_weather`, `no_position`, `tier_stale`, `tier_insufficient`) describe a
 * district that was computed with less than it should have; `weather_held` (no district; params `count`,
 * `stations`) says how many station-days of the season were held as implausible and left out. `message` is only on runs stored before
 * warnings became codes.
 */
export const runWarning = z.object({
  code: z.string(),
  districtId: z.string().optional(),
  districtName: z.string().optional(),
  params: problemParams.optional(),
  reason: problemReason.optional(),
  message: z.string().optional(),
});
export type RunWarning = z.infer<typeof runWarning>;

/** One district a bulletin send left out because its bulletin could not be written, and why. */
export const skippedDistrict = z.object({ districtId: z.string(), districtName: z.string(), reason: problemReason });
export type SkippedDistrict = z.infer<typeof skippedDistrict>;
