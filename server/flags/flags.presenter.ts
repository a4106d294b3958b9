import { ACTION_CAUTION, type FlagDto } from '../../shared/api/flags.schema';

export interface FlagRecord {
  id: string;
  district_id: string;
  district_code: string;
  district_name: string;
  reason: FlagDto['reason'];
  source: FlagDto['source'];
  status: FlagDto['status'];
  tier: FlagDto['tier'];
  previous_tier: FlagDto['previousTier'];
  epi_year: number | null;
  epi_week: number | null;
  drivers: FlagDto['drivers'];
  suggested_message: string;
  actions: FlagDto['actions'];
  note: string | null;
  raised_by: string | null;
  raiser_name: string | null;
  created_at: Date;
  decided_by: string | null;
  decider_name: string | null;
  decided_at: Date | null;
  decision_reason: string | null;
  final_message: string | null;
  advisory_id: string | null;
  version: number;
}

/** One flag with its district, people and advisory, for list and detail alike. */
export const FLAG_SELECT = `
  SELECT f.*, d.code AS district_code, d.name AS district_name, r.display_name AS raiser_name, s.display_name AS decider_name,
         a.id AS advisory_id
    FROM flags f
    JOIN districts d ON d.id = f.district_id
    LEFT JOIN users r ON r.id = f.raised_by
    LEFT JOIN users s ON s.id = f.decided_by
    LEFT JOIN advisories a ON a.flag_id = f.id`;

export const presentFlag = (r: FlagRecord): FlagDto => ({
  id: r.id,
  districtId: r.district_id,
  districtCode: r.district_code,
  districtName: r.district_name,
  reason: r.reason,
  source: r.source,
  status: r.status,
  tier: r.tier,
  previousTier: r.previous_tier,
  epiYear: r.epi_year,
  epiWeek: r.epi_week,
  drivers: r.drivers,
  suggestedMessage: r.suggested_message,
  actions: r.actions,
  caution: ACTION_CAUTION,
  note: r.note,
  raisedBy: r.raised_by ? { id: r.raised_by, displayName: r.raiser_name ?? '' } : null,
  createdAt: new Date(r.created_at).toISOString(),
  decidedBy: r.decided_by ? { id: r.decided_by, displayName: r.decider_name ?? '' } : null,
  decidedAt: r.decided_at ? new Date(r.decided_at).toISOString() : null,
  decisionReason: r.decision_reason,
  finalMessage: r.final_message,
  advisoryId: r.advisory_id,
  version: r.version,
});
