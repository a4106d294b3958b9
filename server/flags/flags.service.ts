import type { EntityManager } from 'typeorm';
import type { AdvisoryMessage, ApproveFlagBody, FlagDetailResponse, FlagDto, FlagReason, FlagStatus, RaiseFlagBody, RejectFlagBody } from '../../shared/api/flags.schema';
import { composeMessage, customMessage } from '../../shared/flags/advisory-message';
import { TIERS, tierRank, type DriverResult, type Tier, type TierResult } from '../../shared/tier';
import { advisoryMail } from '../advisories/advisory.mails';
import { AdvisoryEntity } from '../advisories/advisory.entity';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { assertAssigned, type Principal } from '../auth/principal';
import { recipientsOf, subscriberLinks } from '../bulletins/subscriptions.service';
import { languageHeaders } from '../bulletins/bulletin-texts';
import { badRequest, conflict, forbidden, notFound } from '../http/errors';
import { enqueueMail } from '../outbox/outbox.repository';
import { actionsOf, englishMessage, renderMessage, suggestedActions } from './flag-texts';
import { FlagEntity } from './flag.entity';
import { FLAG_SELECT, LAPSE_WEEKS_SQL, lapsedSql, presentFlag, type FlagRecord } from './flags.presenter';

const asTier = (t: string | null | undefined): Tier | null => (t && (TIERS as readonly string[]).includes(t) ? (t as Tier) : null);
const casesDetail = (drivers: DriverResult[] | null | undefined) => drivers?.find((d) => d.id === 'cases')?.detail ?? null;

export interface SeasonFlagInput {
  runId: string;
  districtId: string;
  epiYear: number;
  epiWeek: number;
  tier: TierResult;
  /** The district's tier before this week (null on its first-ever tier). */
  previousTier: string | null;
  /** The drivers of that earlier tier, to tell a crossing from a district that stays above. */
  previousDrivers: DriverResult[] | null;
  channelZone: 'below' | 'within' | 'above' | null;
}

/** Insert a flag unless one is open for the district and reason (the partial unique index decides); audited. */
async function insertFlag(manager: EntityManager, row: Partial<FlagEntity>, actorId: string | null): Promise<string | null> {
  await storeLapsed(manager, row.districtId!, [row.reason!]);
  const result = await manager.createQueryBuilder().insert().into(FlagEntity).values(row).orIgnore().returning(['id']).execute();
  const id: string | undefined = result.raw[0]?.id;
  if (!id) return null;
  await recordAudit(manager, {
    actorId, action: 'flag.raised', entity: 'flag', entityId: id,
    after: { districtId: row.districtId, reason: row.reason, source: row.source, tier: row.tier, previousTier: row.previousTier, epiYear: row.epiYear, epiWeek: row.epiWeek },
    reason: row.note ?? null,
  });
  return id;
}

/**
 * Open flags of a district and reason that have lapsed on read are stored as lapsed (audited), so that a
 * newer flag can take their place in the queue (the partial unique index holds one open flag per reason).
 */
async function storeLapsed(manager: EntityManager, districtId: string, reasons: FlagReason[]): Promise<void> {
  // An UPDATE … RETURNING answers [rows, affected count] through TypeORM's query().
  const [lapsed]: [{ id: string; version: number }[], number] = await manager.query(
    `UPDATE flags f SET status = 'lapsed', version = version + 1
      WHERE f.district_id = $1 AND f.reason = ANY($2) AND f.status = 'open' AND ${lapsedSql('f')}
      RETURNING f.id, f.version`,
    [districtId, reasons],
  );
  for (const l of lapsed)
    await recordAudit(manager, {
      actorId: null, action: 'flag.lapsed', entity: 'flag', entityId: l.id,
      before: { status: 'open', version: l.version - 1 }, after: { status: 'lapsed', version: l.version },
    });
}

/**
 * Called by the season run inside each district's transaction, after its tier is written: raises a
 * flag when the tier rises (a first-ever tier at High or Critical counts as a rise), when cases move
 * above the endemic channel, or when the C2 alarm goes off — each at most once per district, reason
 * and epidemiological week, and never while a flag for the same district and reason is open.
 */
export async function raiseSeasonFlags(manager: EntityManager, input: SeasonFlagInput): Promise<string[]> {
  const { tier } = input;
  if (tier.confidence === 'insufficient') return [];
  const now = tier.tier;
  const before = asTier(input.previousTier);
  const prevCases = casesDetail(input.previousDrivers);
  const alarm = casesDetail(tier.drivers)?.aberrationAlarm === true;
  const reasons: FlagReason[] = [];
  if (before ? tierRank(now) > tierRank(before) : tierRank(now) >= tierRank('high')) reasons.push('tier-rise');
  if (input.channelZone === 'above' && prevCases?.zone !== 'above') reasons.push('channel-above');
  if (alarm && prevCases?.aberrationAlarm !== true) reasons.push('case-alarm');
  if (reasons.length === 0) return [];

  const [district] = await manager.query(`SELECT name FROM districts WHERE id = $1`, [input.districtId]);
  await storeLapsed(manager, input.districtId, reasons);
  const already: { reason: string }[] = await manager.query(
    `SELECT reason FROM flags WHERE district_id = $1 AND reason = ANY($2)
        AND (status = 'open' OR (source = 'season-run' AND epi_year = $3 AND epi_week = $4))`,
    [input.districtId, reasons, input.epiYear, input.epiWeek],
  );
  const ids: string[] = [];
  for (const reason of reasons.filter((r) => !already.some((a) => a.reason === r))) {
    const message = composeMessage({
      district: district?.name ?? '', reason, tier: now, previousTier: before, epiYear: input.epiYear, epiWeek: input.epiWeek, drivers: tier.drivers,
    });
    const id = await insertFlag(manager, {
      districtId: input.districtId, reason, source: 'season-run', status: 'open', tier: now, previousTier: before,
      epiYear: input.epiYear, epiWeek: input.epiWeek, runId: input.runId, drivers: tier.drivers,
      suggestedMessage: englishMessage(message), messageCode: message.code, messageParams: message.params,
      actions: suggestedActions(reason, now), note: null, publicMessage: null, raisedBy: null,
    }, null);
    if (id) ids.push(id);
  }
  return ids;
}


/** Flags raised by hand, the sign-off queue (open, lapsed) and its decisions. */
export class FlagsService {
  constructor(private readonly ctx: AppContext) {}

  /**
   * The queue: open flags, highest tier first, then newest. An open flag older than the flag settings
   * allow is listed as `lapsed` (lapse on read), no longer as open. Decided ones newest first.
   */
  async list(query: { status: FlagStatus | 'all'; districtId?: string }): Promise<{ flags: FlagDto[]; lapseWeeks: number }> {
    const rows: FlagRecord[] = await this.ctx.ds.query(
      `WITH q AS (${FLAG_SELECT})
       SELECT * FROM q
        WHERE ($1 = 'all' OR (CASE WHEN q.lapsed THEN 'lapsed' ELSE q.status END) = $1) AND ($2::uuid IS NULL OR q.district_id = $2)
        ORDER BY (q.status = 'open' AND NOT q.lapsed) DESC,
                 CASE WHEN q.status = 'open' AND NOT q.lapsed THEN array_position(ARRAY['baseline', 'raised', 'high', 'critical'], q.tier) END DESC NULLS LAST,
                 q.created_at DESC
        LIMIT 500`,
      [query.status, query.districtId ?? null],
    );
    const [{ weeks }] = await this.ctx.ds.query(`SELECT ${LAPSE_WEEKS_SQL} AS weeks`);
    return { flags: rows.map(presentFlag), lapseWeeks: weeks };
  }

  async get(id: string, manager: EntityManager = this.ctx.ds.manager): Promise<FlagDto> {
    const [row]: FlagRecord[] = await manager.query(`${FLAG_SELECT} WHERE f.id = $1`, [id]);
    if (!row) throw notFound('The flag');
    return presentFlag(row);
  }

  /** The flag and its history: every audit event of the flag and of the advisory it became. */
  async detail(id: string): Promise<FlagDetailResponse> {
    const flag = await this.get(id);
    const events: any[] = await this.ctx.ds.query(
      `SELECT e.at, e.action, e.reason, e.before, e.after, u.id AS actor_id, u.display_name AS actor_name
         FROM audit_events e LEFT JOIN users u ON u.id = e.actor_id
        WHERE (e.entity = 'flag' AND e.entity_id = $1) OR (e.entity = 'advisory' AND e.entity_id = $2)
        ORDER BY e.at, e.id`,
      [id, flag.advisoryId ?? ''],
    );
    return {
      flag,
      history: events.map((e) => ({
        at: new Date(e.at).toISOString(), action: e.action, reason: e.reason, before: e.before, after: e.after,
        actor: e.actor_id ? { id: e.actor_id, displayName: e.actor_name } : null,
      })),
    };
  }

  /**
   * A health officer (any district) or an epidemiologist (assigned districts) raises a flag by hand. The
   * note is internal (for the supervisor); the public message is theirs when given, else composed from
   * the district's newest tier and drivers. The note is never part of the public message.
   */
  async raise(p: Principal, body: RaiseFlagBody): Promise<FlagDto> {
    assertAssigned(p, body.districtId);
    return this.ctx.ds.transaction(async (manager) => {
      const [district] = await manager.query(`SELECT id, name FROM districts WHERE id = $1`, [body.districtId]);
      if (!district) throw badRequest('unknown_district', 'The district does not exist.', [{ path: 'districtId', message: 'is not a district' }]);
      const [latest] = await manager.query(
        `SELECT tier, drivers, epi_year, epi_week, run_id FROM district_tiers WHERE district_id = $1 ORDER BY epi_year DESC, epi_week DESC LIMIT 1`,
        [body.districtId],
      );
      const tier = asTier(latest?.tier);
      const drivers: DriverResult[] = latest?.drivers ?? [];
      const facts = { district: district.name, reason: 'manual' as const, tier, previousTier: null, epiYear: latest?.epi_year ?? null, epiWeek: latest?.epi_week ?? null };
      const message: AdvisoryMessage = body.message ? customMessage(body.message, facts) : composeMessage({ ...facts, drivers });
      const id = await insertFlag(manager, {
        districtId: body.districtId, reason: 'manual', source: 'manual', status: 'open', tier, previousTier: null,
        epiYear: facts.epiYear, epiWeek: facts.epiWeek, runId: latest?.run_id ?? null, drivers,
        suggestedMessage: englishMessage(message), messageCode: message.code, messageParams: message.params,
        actions: body.actions ? actionsOf(body.actions) : suggestedActions('manual', tier),
        note: body.note, publicMessage: body.message ?? null, raisedBy: p.userId,
      }, p.userId);
      if (!id) throw conflict('flag_open', 'A flag raised by hand for this district is already waiting for sign-off.');
      return this.get(id, manager);
    });
  }

  /**
   * Approve (optionally with an edited message): the flag becomes an advisory mailed to the district's
   * subscribers, each in their language. A superseded flag's advisory speaks of the district's tier now
   * and states the flag's date; a lapsed flag cannot be approved (409 `flag_lapsed`).
   */
  async approve(p: Principal, id: string, body: ApproveFlagBody): Promise<FlagDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const current = await this.decidable(manager, p, id, body.version);
      if (current.status === 'lapsed')
        throw conflict('flag_lapsed', 'This flag waited longer than the flag settings allow and has lapsed: raise a new one if it still applies.', { lapsesAt: current.lapsesAt });
      const proposal = current.proposal;
      const edited = body.message !== undefined && body.message !== renderMessage(proposal.code, proposal.params, 'en');
      const composed: AdvisoryMessage = edited
        ? customMessage(body.message!, { ...proposal.params, shares: [] })
        : proposal;
      const message = englishMessage(composed);
      const tier = current.superseded && current.current ? current.current.tier : current.tier;
      const [updated] = await manager.query(
        `WITH u AS (UPDATE flags SET status = 'approved', decided_by = $2, decided_at = now(), final_message = $3, version = version + 1
                     WHERE id = $1 AND status = 'open' AND version = $4 RETURNING id) SELECT id FROM u`,
        [id, p.userId, message, current.version],
      );
      if (!updated) await this.lost(manager, id);
      const advisory = await manager.save(AdvisoryEntity, manager.create(AdvisoryEntity, {
        flagId: id, districtId: current.districtId, tier, message, messageCode: composed.code, messageParams: composed.params,
        actions: current.actions, issuedBy: p.userId,
        issuedAt: new Date(), expiresAt: new Date(Date.now() + this.ctx.config.ADVISORY_DAYS * 86_400_000),
      }));
      const recipients = await recipientsOf(manager, current.districtId, 'advisory');
      const queued = await enqueueMail(manager, this.ctx.config, recipients.map((r) => {
        const links = subscriberLinks(this.ctx.config, r.userId, current.districtId);
        // In the recipient's language, worded from the message's code and numbers (a person's words stay theirs).
        const mail = advisoryMail({
          districtName: current.districtName, districtCode: current.districtCode, tier, message: renderMessage(composed.code, composed.params, r.language),
          actions: current.actions, issuedBy: p.displayName, unsubscribeUrl: links.unsubscribeUrl, preferencesUrl: links.preferencesUrl, language: r.language,
        });
        return { kind: 'advisory' as const, to: r.email, userId: r.userId, ...mail, headers: { ...links.headers, ...languageHeaders(r.language) }, advisoryId: advisory.id };
      }));
      await recordAudit(manager, {
        actorId: p.userId, action: 'flag.approved', entity: 'flag', entityId: id,
        before: { status: 'open', message: current.suggestedMessage, messageCode: current.message.code, tier: current.tier, version: current.version },
        after: {
          status: 'approved', message, messageCode: composed.code, edited, tier, superseded: current.superseded, version: current.version + 1,
        },
      });
      await recordAudit(manager, {
        actorId: p.userId, action: 'advisory.issued', entity: 'advisory', entityId: advisory.id,
        after: { flagId: id, districtId: current.districtId, tier, recipients: queued, expiresAt: advisory.expiresAt.toISOString() },
      });
      return this.get(id, manager);
    });
  }

  /** Reject with a reason; a lapsed flag may be rejected too (it then leaves the lapsed list). */
  async reject(p: Principal, id: string, body: RejectFlagBody): Promise<FlagDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const current = await this.decidable(manager, p, id, body.version);
      const [updated] = await manager.query(
        `WITH u AS (UPDATE flags SET status = 'rejected', decided_by = $2, decided_at = now(), decision_reason = $3, version = version + 1
                     WHERE id = $1 AND status IN ('open', 'lapsed') AND version = $4 RETURNING id) SELECT id FROM u`,
        [id, p.userId, body.reason, current.version],
      );
      if (!updated) await this.lost(manager, id);
      await recordAudit(manager, {
        actorId: p.userId, action: 'flag.rejected', entity: 'flag', entityId: id,
        before: { status: current.status, version: current.version }, after: { status: 'rejected', version: current.version + 1 }, reason: body.reason,
      });
      return this.get(id, manager);
    });
  }

  /** The flag as the supervisor saw it; refused when it is theirs, already decided, or changed since. */
  private async decidable(manager: EntityManager, p: Principal, id: string, version?: number): Promise<FlagDto> {
    const flag = await this.get(id, manager);
    if (flag.raisedBy?.id === p.userId) throw forbidden('You raised this flag: another supervisor signs it off.');
    if (flag.status !== 'open' && flag.status !== 'lapsed') throw this.decided(flag);
    if (version !== undefined && version !== flag.version)
      throw conflict('flag_changed', 'The flag changed since you opened it. Reload it and decide again.');
    return flag;
  }

  /** The conditional UPDATE matched nothing: someone else decided first (their transaction committed). */
  private async lost(manager: EntityManager, id: string): Promise<never> {
    throw this.decided(await this.get(id, manager));
  }

  private decided(flag: FlagDto) {
    const who = flag.decidedBy ? ` by ${flag.decidedBy.displayName}` : '';
    return conflict('flag_decided', `This flag was already ${flag.status === 'open' ? 'changed' : flag.status}${who}. Reload to see the decision.`, {
      status: flag.status, decidedBy: flag.decidedBy?.displayName ?? null,
    });
  }
}
