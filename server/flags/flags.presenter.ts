import { ACTION_CAUTION, DEFAULT_LAPSE_WEEKS, type AdvisoryMessage, type FlagDto, type MessageCode, type MessageParams } from '../../shared/api/flags.schema';
import { composeMessage, customMessage } from '../../shared/flags/advisory-message';
import { TIERS, type DriverResult, type Tier } from '../../shared/tier';

export interface FlagRecord {
  id: string;
  district_id: string;
  district_code: string;
  district_name: string;
  reason: FlagDto['reason'];
  source: FlagDto['source'];
  /** As stored ('open' also for a flag that has lapsed on read: see `lapsed`). */
  status: FlagDto['status'];
  tier: FlagDto['tier'];
  previous_tier: FlagDto['previousTier'];
  epi_year: number | null;
  epi_week: number | null;
  run_id: string | null;
  drivers: FlagDto['drivers'];
  suggested_message: string;
  message_code: MessageCode | null;
  message_params: MessageParams | null;
  actions: FlagDto['actions'];
  note: string | null;
  public_message: string | null;
  raised_by: string | null;
  raiser_name: string | null;
  created_at: Date;
  decided_by: string | null;
  decider_name: string | null;
  decided_at: Date | null;
  decision_reason: string | null;
  final_message: string | null;
  advisory_id: string | null;
  advisory_code: MessageCode | null;
  advisory_params: MessageParams | null;
  version: number;
  /** Computed by FLAG_SELECT: the open flag is older than the flag settings allow. */
  lapsed: boolean;
  lapses_at: Date | null;
  cur_tier: string | null;
  cur_year: number | null;
  cur_week: number | null;
  cur_run: string | null;
  cur_at: Date | null;
  cur_drivers: DriverResult[] | null;
}

/** The lapse setting in weeks, read where it is needed (SQL), the default when no admin has set it. */
export const LAPSE_WEEKS_SQL = `COALESCE((SELECT s.lapse_weeks FROM flag_settings s WHERE s.id = 1), ${DEFAULT_LAPSE_WEEKS})`;
/**
 * When a flag's age starts: when it was raised, or — for a flag the season run raised while computing an
 * earlier date (a catch-up of past weeks at start-up, a rerun) — the day after that run's as-of date. A
 * catch-up's flags for week 42 are as old as week 42, not as new as the day the catch-up ran.
 */
export const flagAgeFromSql = (alias: string) =>
  `LEAST(${alias}.created_at, (SELECT (sr.as_of + 1)::timestamptz FROM season_runs sr WHERE sr.id = ${alias}.run_id))`;
/** An open flag older than the setting has lapsed (lapse on read; no job needed). */
export const lapsedSql = (alias: string) => `(${alias}.status = 'lapsed' OR (${alias}.status = 'open' AND ${flagAgeFromSql(alias)} <= now() - make_interval(weeks => ${LAPSE_WEEKS_SQL})))`;

/**
 * One flag with its district, people, advisory, the district's tier now (its newest season run) and
 * whether it has lapsed; for list and detail alike. The status as read is `f_status`.
 */
export const FLAG_SELECT = `
  SELECT f.*, d.code AS district_code, d.name AS district_name, r.display_name AS raiser_name, s.display_name AS decider_name,
         a.id AS advisory_id, a.message_code AS advisory_code, a.message_params AS advisory_params, ${lapsedSql('f')} AS lapsed,
         CASE WHEN f.status = 'open' THEN ${flagAgeFromSql('f')} + make_interval(weeks => ${LAPSE_WEEKS_SQL}) END AS lapses_at,
         cur.tier AS cur_tier, cur.epi_year AS cur_year, cur.epi_week AS cur_week, cur.run_id AS cur_run, cur.computed_at AS cur_at,
         cur.drivers AS cur_drivers
    FROM flags f
    JOIN districts d ON d.id = f.district_id
    LEFT JOIN users r ON r.id = f.raised_by
    LEFT JOIN users s ON s.id = f.decided_by
    LEFT JOIN advisories a ON a.flag_id = f.id
    LEFT JOIN LATERAL (
      SELECT t.tier, t.epi_year, t.epi_week, t.run_id, t.computed_at, t.drivers FROM district_tiers t
       WHERE t.district_id = f.district_id ORDER BY t.epi_year DESC, t.epi_week DESC LIMIT 1
    ) cur ON true`;

const asTier = (t: string | null | undefined): Tier | null => (t && (TIERS as readonly string[]).includes(t) ? (t as Tier) : null);
const dateOf = (x: Date) => new Date(x).toISOString().slice(0, 10);

/**
 * A newer season run has computed the district's tier since the flag was raised: a later week, or the
 * same week computed again by another run (the flag keeps the run whose tier it was raised from).
 */
export function isSuperseded(r: Pick<FlagRecord, 'epi_year' | 'epi_week' | 'run_id' | 'cur_year' | 'cur_week' | 'cur_run'>): boolean {
  if (r.cur_year === null || r.cur_week === null) return false;
  if (r.epi_year === null || r.epi_week === null) return true;
  if (r.cur_year * 100 + r.cur_week > r.epi_year * 100 + r.epi_week) return true;
  return r.cur_run !== r.run_id;
}

/** The flag's own suggested message as code and numbers (composed again from its stored facts when raised before codes existed). */
export function flagMessage(r: Pick<FlagRecord, 'message_code' | 'message_params' | 'district_name' | 'reason' | 'tier' | 'previous_tier' | 'epi_year' | 'epi_week' | 'drivers' | 'public_message'>): AdvisoryMessage {
  if (r.message_code && r.message_params) return { code: r.message_code, params: r.message_params };
  const base = { district: r.district_name, reason: r.reason, tier: asTier(r.tier), previousTier: asTier(r.previous_tier), epiYear: r.epi_year, epiWeek: r.epi_week };
  if (r.public_message) return customMessage(r.public_message, base);
  return composeMessage({ ...base, drivers: r.drivers ?? [] });
}

/**
 * What approving the flag unedited sends now: its own message, or, when a newer season run superseded it,
 * a message worded from the district's current tier and drivers that states the flag's date, week and tier.
 */
export function flagProposal(r: FlagRecord): AdvisoryMessage {
  const own = flagMessage(r);
  const curTier = asTier(r.cur_tier);
  if (!isSuperseded(r) || !curTier || r.cur_year === null || r.cur_week === null) return own;
  const flag = { raisedOn: dateOf(r.created_at), epiYear: r.epi_year, epiWeek: r.epi_week, tier: asTier(r.tier) };
  const now = { district: r.district_name, reason: r.reason, tier: curTier, previousTier: null, epiYear: r.cur_year, epiWeek: r.cur_week, flag };
  if (own.code === 'custom') return customMessage(own.params.text ?? '', now);
  return composeMessage({ ...now, drivers: r.cur_drivers ?? [] });
}

/** Only a flag still waiting (open or lapsed) can be superseded: a decided one was decided on what it said. */
const waiting = (r: FlagRecord) => r.status === 'open' || r.status === 'lapsed';

export const presentFlag = (r: FlagRecord): FlagDto => ({
  id: r.id,
  districtId: r.district_id,
  districtCode: r.district_code,
  districtName: r.district_name,
  reason: r.reason,
  source: r.source,
  status: r.lapsed ? 'lapsed' : r.status,
  tier: r.tier,
  previousTier: r.previous_tier,
  epiYear: r.epi_year,
  epiWeek: r.epi_week,
  drivers: r.drivers,
  suggestedMessage: r.suggested_message,
  message: flagMessage(r),
  proposal: waiting(r) ? flagProposal(r) : flagMessage(r),
  actions: r.actions,
  caution: ACTION_CAUTION,
  note: r.note,
  publicMessage: r.public_message,
  current:
    asTier(r.cur_tier) && r.cur_year !== null && r.cur_week !== null && r.cur_at
      ? { tier: asTier(r.cur_tier)!, epiYear: r.cur_year, epiWeek: r.cur_week, computedAt: new Date(r.cur_at).toISOString(), drivers: r.cur_drivers ?? [] }
      : null,
  superseded: waiting(r) && isSuperseded(r),
  lapsesAt: r.status === 'open' && r.lapses_at ? new Date(r.lapses_at).toISOString() : null,
  raisedBy: r.raised_by ? { id: r.raised_by, displayName: r.raiser_name ?? '' } : null,
  createdAt: new Date(r.created_at).toISOString(),
  decidedBy: r.decided_by ? { id: r.decided_by, displayName: r.decider_name ?? '' } : null,
  decidedAt: r.decided_at ? new Date(r.decided_at).toISOString() : null,
  decisionReason: r.decision_reason,
  finalMessage: r.final_message,
  finalComposed: r.advisory_code && r.advisory_params ? { code: r.advisory_code, params: r.advisory_params } : null,
  advisoryId: r.advisory_id,
  version: r.version,
});

/** The advisory's columns and its flag's, as the advisory readers select them (ADVISORY_MESSAGE_COLUMNS). */
export interface AdvisoryMessageRecord {
  message: string;
  message_code: MessageCode | null;
  message_params: MessageParams | null;
  district_name: string;
  f_reason: FlagDto['reason'] | null;
  f_tier: string | null;
  f_previous_tier: string | null;
  f_epi_year: number | null;
  f_epi_week: number | null;
  f_drivers: DriverResult[] | null;
  f_suggested_message: string | null;
  f_public_message: string | null;
  f_message_code: MessageCode | null;
  f_message_params: MessageParams | null;
}
/** Select these with `FROM advisories a JOIN districts d … LEFT JOIN flags f ON f.id = a.flag_id`. */
export const ADVISORY_MESSAGE_COLUMNS = `a.message, a.message_code, a.message_params, d.name AS district_name, f.reason AS f_reason, f.tier AS f_tier,
  f.previous_tier AS f_previous_tier, f.epi_year AS f_epi_year, f.epi_week AS f_epi_week, f.drivers AS f_drivers,
  f.suggested_message AS f_suggested_message, f.public_message AS f_public_message, f.message_code AS f_message_code, f.message_params AS f_message_params`;

/**
 * An advisory's message as code and numbers. Advisories issued before messages were composed: one sent as
 * Broodcast suggested it is composed again from its flag's stored facts (so it reads in every language,
 * and a hand-raised flag's internal note is no longer part of it); one a person wrote stays as stored (null).
 */
export function advisoryComposed(a: AdvisoryMessageRecord): AdvisoryMessage | null {
  if (a.message_code && a.message_params) return { code: a.message_code, params: a.message_params };
  if (!a.f_reason || a.f_suggested_message === null || a.message !== a.f_suggested_message) return null;
  return flagMessage({
    message_code: a.f_message_code, message_params: a.f_message_params, district_name: a.district_name, reason: a.f_reason, tier: asTier(a.f_tier),
    previous_tier: asTier(a.f_previous_tier), epi_year: a.f_epi_year, epi_week: a.f_epi_week, drivers: a.f_drivers ?? [], public_message: a.f_public_message,
  });
}
