import type { BulletinPreviewResponse, BulletinSendResponse } from '../../shared/api/bulletins.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { conflict, notFound } from '../http/errors';
import { reasonOf } from '../http/problem-reason';
import { withAdvisoryLock } from '../../jobs/advisory-lock';
import { enqueueMail } from '../outbox/outbox.repository';
import { DEFAULT_LANGUAGE, type Language } from '../i18n';
import { BulletinDataReader, renderBulletin, type BulletinData } from './bulletin-data';
import { BulletinDigestEntity } from './bulletin-digest.entity';
import { digestFooter, languageHeaders, mailFooter } from './bulletin-texts';
import { bulletinHtml, bulletinPdf, bulletinSubject, bulletinText, withFooter } from './bulletin.render';
import { BulletinEntity } from './bulletin.entity';
import { digestData, digestPdfName, renderDigest, type DigestData, type DigestVersion } from './digest.render';
import { subscriberLinks } from './subscriptions.service';
import { recipientsOf, recipientsOfDistricts, type Recipient } from './recipients.repository';

export const BULLETIN_LOCK = 'bulletin';

/**
 * The weekly bulletin: one per district and epidemiological week (the Ladder's newest week), written
 * with its PDF and queued to the district's subscribers in one transaction per district. Writing the
 * same week again queues nothing (one bulletin per district and week).
 */
export class BulletinsService {
  private readonly reader: BulletinDataReader;

  /** For fault-injection tests: called before each district's bulletin is written; a throw is that district's failure. */
  districtHook?: (districtId: string) => void;
  /** For fault-injection tests: called before each person's digest is written; a throw is that reader's failure. */
  recipientHook?: (userId: string) => void;

  constructor(private readonly ctx: AppContext) {
    this.reader = new BulletinDataReader(ctx);
  }

  private async data(districtId?: string): Promise<BulletinData> {
    const board = await this.reader.ranking();
    const id = districtId ?? board.rows[0]?.districtId;
    if (!id || !board.rows.some((r) => r.districtId === id)) throw notFound('The district');
    const data = await this.reader.read(id, board);
    if (!data) throw conflict('no_tiers_yet', 'No season run has produced tiers yet, so there is no bulletin to show.');
    return data;
  }

  async preview(districtId?: string, language: Language = DEFAULT_LANGUAGE): Promise<BulletinPreviewResponse> {
    const d = await this.data(districtId);
    const [sent] = await this.ctx.ds.query(`SELECT 1 FROM bulletins WHERE district_id = $1 AND epi_year = $2 AND epi_week = $3`, [d.district.id, d.epiYear, d.epiWeek]);
    const recipients = await recipientsOf(this.ctx.ds.manager, d.district.id, 'bulletin');
    const footer = mailFooter(d.district.name, '(your own link)', '(the preferences page)', language);
    return {
      districtId: d.district.id, districtName: d.district.name, epiYear: d.epiYear, epiWeek: d.epiWeek, language,
      subject: bulletinSubject(d, language), text: `${bulletinText(d, language)}\n\n${footer.text}`, recipients: recipients.length, alreadySent: !!sent,
    };
  }

  async previewHtml(districtId: string, language: Language = DEFAULT_LANGUAGE): Promise<string> {
    const d = await this.data(districtId);
    return withFooter(bulletinHtml(d, language), mailFooter(d.district.name, '#', '#', language).html);
  }

  async previewPdf(districtId: string, language: Language = DEFAULT_LANGUAGE): Promise<{ filename: string; pdf: Buffer }> {
    const d = await this.data(districtId);
    return {
      filename: `broodcast-bulletin-${d.district.code}-${d.epiYear}-w${String(d.epiWeek).padStart(2, '0')}-${language}.pdf`,
      pdf: await bulletinPdf(d, language),
    };
  }

  /**
   * The signed-in person's own digest of this week as the Monday mail would bring it (their districts, their
   * layout), in their language or `language`. Nothing is written.
   */
  async previewDigest(p: Principal, language?: Language): Promise<{ g: DigestData; language: Language; v: DigestVersion; html: string }> {
    const board = await this.reader.ranking();
    if (board.epiYear === null || board.epiWeek === null) throw conflict('no_tiers_yet', 'No season run has produced tiers yet, so there is no bulletin to show.');
    const [me] = await this.ctx.ds.query(`SELECT language FROM users WHERE id = $1`, [p.userId]);
    const lang: Language = language ?? me?.language ?? DEFAULT_LANGUAGE;
    const data = new Map<string, BulletinData>();
    const followed: string[] = [];
    const candidates = board.rows.filter((row) => row.confidence !== 'insufficient');
    // One query for every district (it was one per district, issue 21): the districts whose bulletin this person receives.
    const mine = new Set(
      (await recipientsOfDistricts(this.ctx.ds.manager, candidates.map((row) => row.districtId), 'bulletin', p.userId)).map((r) => r.districtId),
    );
    for (const row of candidates) {
      if (!mine.has(row.districtId)) continue;
      followed.push(row.districtId);
      data.set(row.districtId, (await this.reader.read(row.districtId, board))!);
    }
    const regions: { name: string }[] = (p.regionIds ?? []).length
      ? await this.ctx.ds.query(`SELECT name FROM regions WHERE id = ANY($1::uuid[]) ORDER BY name`, [p.regionIds])
      : [];
    const g = digestData({
      region: regions.length ? regions.map((r) => r.name).join(', ') : this.ctx.config.REGION_NAME,
      epiYear: board.epiYear, epiWeek: board.epiWeek, role: p.role,
      followedIds: followed, assigned: p.districtIds, data, board: board.rows,
      scope: regions.length ? new Set(p.districtIds) : null,
    });
    const v = await renderDigest(g, lang);
    const footer = digestFooter(g.followed, '#', '#', lang);
    return { g, language: lang, v: { ...v, text: `${v.text}\n\n${footer.text}` }, html: withFooter(v.html, footer.html) };
  }

  /** Send now (supervisor, admin): the same work as the weekly job, under its lock; 409 while it runs. */
  async sendNow(actor: Principal): Promise<BulletinSendResponse> {
    const { ran, result } = await withAdvisoryLock(this.ctx.ds, BULLETIN_LOCK, () => this.writeWeek(actor));
    if (!ran) throw conflict('bulletin_in_progress', 'The bulletin is being written right now. Try again in a minute.');
    return result!;
  }

  /** For the weekly job: null when another process holds the lock. */
  async sendLocked(): Promise<BulletinSendResponse | null> {
    const { ran, result } = await withAdvisoryLock(this.ctx.ds, BULLETIN_LOCK, () => this.writeWeek(null));
    return ran ? result! : null;
  }

  private async writeWeek(actor: Principal | null): Promise<BulletinSendResponse> {
    const board = await this.reader.ranking();
    const out: BulletinSendResponse = {
      epiYear: board.epiYear, epiWeek: board.epiWeek, bulletinsWritten: 0, districtsSkipped: 0, messagesQueued: 0, districtsFailed: [],
      digestsWritten: 0, recipientsFailed: [],
    };
    if (board.epiYear === null || board.epiWeek === null) return out;
    const done = new Set<string>(
      (await this.ctx.ds.query(`SELECT district_id FROM bulletins WHERE epi_year = $1 AND epi_week = $2`, [board.epiYear, board.epiWeek]))
        .map((r: { district_id: string }) => r.district_id),
    );
    // 1. Each district's bulletin of the week, kept as its record (and what its preview says was sent).
    const data = new Map<string, BulletinData>();
    for (const row of board.rows) {
      if (row.confidence === 'insufficient') {
        out.districtsSkipped += 1;
        continue;
      }
      // A district whose data cannot be read or rendered is left out of every digest and reported; every
      // other district still goes out (issue 14, "isolation").
      try {
        this.districtHook?.(row.districtId);
        const d = (await this.reader.read(row.districtId, board))!;
        const written = done.has(row.districtId) ? null : await this.writeDistrict(actor, d);
        data.set(row.districtId, d);
        if (written) out.bulletinsWritten += 1;
        else out.districtsSkipped += 1;
      } catch (err) {
        const reason = reasonOf(err);
        out.districtsFailed.push({ districtId: row.districtId, districtName: row.name, reason });
        this.ctx.logger.warn({ district: row.code, reason, err: (err as Error)?.message }, 'bulletin: district left out, others go on');
      }
    }
    // 2. One digest per person of every district they follow, in their language (issue 16).
    const followers = new Map<string, { recipient: Recipient; districtIds: string[] }>();
    // One query for every district, in the same order as asking district after district.
    for (const { districtId, ...r } of await recipientsOfDistricts(this.ctx.ds.manager, [...data.keys()], 'bulletin')) {
      const f = followers.get(r.userId) ?? { recipient: r, districtIds: [] };
      f.districtIds.push(districtId);
      followers.set(r.userId, f);
    }
    const sent = new Set<string>(
      (await this.ctx.ds.query(`SELECT user_id FROM bulletin_digests WHERE epi_year = $1 AND epi_week = $2`, [board.epiYear, board.epiWeek]))
        .map((r: { user_id: string }) => r.user_id),
    );
    const assigned = new Map<string, string[]>();
    // The regions each follower is scoped to: their digest's ranking covers those regions, named in it (issue 17).
    const regionsOf = new Map<string, string[]>();
    for (const r of (await this.ctx.ds.query(
      `SELECT ur.user_id, r.name FROM user_regions ur JOIN regions r ON r.id = ur.region_id WHERE ur.user_id = ANY($1::uuid[]) ORDER BY r.name`,
      [[...followers.keys()]])) as { user_id: string; name: string }[])
      regionsOf.set(r.user_id, [...(regionsOf.get(r.user_id) ?? []), r.name]);
    // A user's assigned districts: their own and every district of their regions (issue 17).
    for (const r of (await this.ctx.ds.query(
      `SELECT user_id, district_id FROM user_districts WHERE user_id = ANY($1::uuid[])
       UNION SELECT ur.user_id, d.id FROM user_regions ur JOIN districts d ON d.region_id = ur.region_id WHERE ur.user_id = ANY($1::uuid[])`,
      [[...followers.keys()]])) as { user_id: string; district_id: string }[])
      assigned.set(r.user_id, [...(assigned.get(r.user_id) ?? []), r.district_id]);
    // People who follow the same districts in the same layout and language read the same digest: render it once.
    const rendered = new Map<string, Promise<{ g: DigestData; v: DigestVersion }>>();
    for (const { recipient: r, districtIds } of followers.values()) {
      if (sent.has(r.userId)) continue;
      try {
        this.recipientHook?.(r.userId);
        const regionNames = regionsOf.get(r.userId) ?? [];
        const g = digestData({
          region: regionNames.length ? regionNames.join(', ') : this.ctx.config.REGION_NAME,
          epiYear: board.epiYear, epiWeek: board.epiWeek, role: r.role,
          followedIds: districtIds, assigned: assigned.get(r.userId) ?? [], data, board: board.rows,
          scope: regionNames.length ? new Set(assigned.get(r.userId) ?? []) : null,
        });
        const scopeKey = regionNames.length ? [...(assigned.get(r.userId) ?? [])].sort().join(',') : '';
        const key = `${g.layout}|${r.language}|${g.region}|${scopeKey}|${g.detailed.map((d) => d.district.id).join(',')}|${districtIds.join(',')}`;
        if (!rendered.has(key)) rendered.set(key, renderDigest(g, r.language).then((v) => ({ g, v })));
        const version = await rendered.get(key)!;
        const n = await this.writeDigest(actor, r, version.g, version.v);
        if (n > 0) {
          out.digestsWritten += 1;
          out.messagesQueued += n;
        }
      } catch (err) {
        const reason = reasonOf(err);
        out.recipientsFailed.push({ userId: r.userId, email: r.email, reason });
        this.ctx.logger.warn({ user: r.userId, reason, err: (err as Error)?.message }, 'bulletin: one reader\'s digest left out, others go on');
      }
    }
    this.ctx.logger.info({ ...out, districtsFailed: out.districtsFailed.length, recipientsFailed: out.recipientsFailed.length }, 'bulletin written');
    return out;
  }

  /** Write one district's bulletin of the week (its record, in the default language); false when another process wrote it first. */
  private async writeDistrict(actor: Principal | null, d: BulletinData): Promise<boolean> {
    const { subject, html, text, pdf } = await renderBulletin(d, DEFAULT_LANGUAGE);
    return this.ctx.ds.transaction(async (manager) => {
      const inserted = await manager.createQueryBuilder().insert().into(BulletinEntity)
        .values({ districtId: d.district.id, epiYear: d.epiYear, epiWeek: d.epiWeek, subject, html, text, pdf, createdBy: actor?.userId ?? null })
        .orIgnore().returning(['id']).execute();
      const bulletinId: string | undefined = inserted.raw[0]?.id;
      if (!bulletinId) return false; // another process wrote it first
      await recordAudit(manager, {
        actorId: actor?.userId ?? null, action: 'bulletin.written', entity: 'bulletin', entityId: bulletinId,
        after: { districtId: d.district.id, epiYear: d.epiYear, epiWeek: d.epiWeek },
        reason: actor ? 'sent now from the Bulletin screen' : 'weekly schedule',
      });
      return true;
    });
  }

  /** Write one person's digest and queue its one mail, in one transaction; 0 when it was already written this week. */
  private async writeDigest(actor: Principal | null, r: Recipient, g: DigestData, v: DigestVersion): Promise<number> {
    const links = subscriberLinks(this.ctx.config, r.userId, null);
    const footer = digestFooter(g.followed, links.unsubscribeUrl, links.preferencesUrl, r.language);
    return this.ctx.ds.transaction(async (manager) => {
      const inserted = await manager.createQueryBuilder().insert().into(BulletinDigestEntity)
        .values({
          userId: r.userId, epiYear: g.epiYear, epiWeek: g.epiWeek, language: r.language, layout: g.layout,
          districtIds: g.followedIds, subject: v.subject,
          pdfName: digestPdfName(g.region, g.epiYear, g.epiWeek), pdf: v.pdf, createdBy: actor?.userId ?? null,
        })
        .orIgnore().returning(['id']).execute();
      const digestId: string | undefined = inserted.raw[0]?.id;
      if (!digestId) return 0;
      return enqueueMail(manager, this.ctx.config, [{
        kind: 'bulletin', to: r.email, userId: r.userId, subject: v.subject, text: `${v.text}\n\n${footer.text}`,
        html: withFooter(v.html, footer.html), headers: { ...links.headers, ...languageHeaders(r.language) }, digestId,
      }]);
    });
  }
}
