import type { BulletinPreviewResponse, BulletinSendResponse } from '../../shared/api/bulletins.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { conflict, notFound } from '../http/errors';
import { reasonOf } from '../http/problem-reason';
import { withAdvisoryLock } from '../../jobs/advisory-lock';
import { enqueueMail } from '../outbox/outbox.repository';
import { DEFAULT_LANGUAGE } from '../i18n';
import { BulletinDataReader, bulletinVersions, renderBulletin, type BulletinData } from './bulletin-data';
import { languageHeaders, mailFooter } from './bulletin-texts';
import { bulletinHtml, bulletinPdf, bulletinSubject, bulletinText, withFooter } from './bulletin.render';
import { BulletinEntity } from './bulletin.entity';
import { recipientsOf, subscriberLinks } from './subscriptions.service';

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

  async preview(districtId?: string): Promise<BulletinPreviewResponse> {
    const d = await this.data(districtId);
    const [sent] = await this.ctx.ds.query(`SELECT 1 FROM bulletins WHERE district_id = $1 AND epi_year = $2 AND epi_week = $3`, [d.district.id, d.epiYear, d.epiWeek]);
    const recipients = await recipientsOf(this.ctx.ds.manager, d.district.id, 'bulletin');
    const footer = mailFooter(d.district.name, '(your own one-click link)', '(the preferences page)');
    return {
      districtId: d.district.id, districtName: d.district.name, epiYear: d.epiYear, epiWeek: d.epiWeek,
      subject: bulletinSubject(d), text: `${bulletinText(d)}\n\n${footer.text}`, recipients: recipients.length, alreadySent: !!sent,
    };
  }

  async previewHtml(districtId: string): Promise<string> {
    const d = await this.data(districtId);
    return withFooter(bulletinHtml(d), mailFooter(d.district.name, '#', '#').html);
  }

  async previewPdf(districtId: string): Promise<{ filename: string; pdf: Buffer }> {
    const d = await this.data(districtId);
    return { filename: `broodcast-bulletin-${d.district.code}-${d.epiYear}-w${String(d.epiWeek).padStart(2, '0')}.pdf`, pdf: await bulletinPdf(d) };
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
    };
    if (board.epiYear === null || board.epiWeek === null) return out;
    const done = new Set<string>(
      (await this.ctx.ds.query(`SELECT district_id FROM bulletins WHERE epi_year = $1 AND epi_week = $2`, [board.epiYear, board.epiWeek]))
        .map((r: { district_id: string }) => r.district_id),
    );
    for (const row of board.rows) {
      if (done.has(row.districtId) || row.confidence === 'insufficient') {
        out.districtsSkipped += 1;
        continue;
      }
      // A district whose data cannot be read or rendered is left out and reported; every other
      // district's subscribers still get theirs (issue 14, "isolation").
      let queued: number | null;
      try {
        queued = await this.writeDistrict(actor, row.districtId, board);
      } catch (err) {
        const reason = reasonOf(err);
        out.districtsFailed.push({ districtId: row.districtId, districtName: row.name, reason });
        this.ctx.logger.warn({ district: row.code, reason, err: (err as Error)?.message }, 'bulletin: district left out, others go on');
        continue;
      }
      if (queued === null) out.districtsSkipped += 1;
      else {
        out.bulletinsWritten += 1;
        out.messagesQueued += queued;
      }
    }
    this.ctx.logger.info({ ...out, districtsFailed: out.districtsFailed.length }, 'bulletin written');
    return out;
  }

  /** Write one district's bulletin and queue it, in one transaction; null when another process wrote it first. */
  private async writeDistrict(actor: Principal | null, districtId: string, board: Awaited<ReturnType<BulletinDataReader['ranking']>>): Promise<number | null> {
    this.districtHook?.(districtId);
    const d = (await this.reader.read(districtId, board))!;
    const base = await renderBulletin(d, DEFAULT_LANGUAGE);
    const { subject, html, text, pdf } = base;
    return this.ctx.ds.transaction(async (manager) => {
      const inserted = await manager.createQueryBuilder().insert().into(BulletinEntity)
        .values({ districtId: d.district.id, epiYear: d.epiYear, epiWeek: d.epiWeek, subject, html, text, pdf, createdBy: actor?.userId ?? null })
        .orIgnore().returning(['id']).execute();
      const bulletinId: string | undefined = inserted.raw[0]?.id;
      if (!bulletinId) return null; // another process wrote it first
      const recipients = await recipientsOf(manager, d.district.id, 'bulletin');
      // Each recipient reads the bulletin (and its PDF) in their own language.
      const versions = await bulletinVersions(manager, bulletinId, d, base, recipients.map((r) => r.language));
      const n = await enqueueMail(manager, this.ctx.config, recipients.map((r) => {
        const links = subscriberLinks(this.ctx.config, r.userId, d.district.id);
        const v = versions.get(r.language)!;
        const footer = mailFooter(d.district.name, links.unsubscribeUrl, links.preferencesUrl, r.language);
        return {
          kind: 'bulletin' as const, to: r.email, userId: r.userId, subject: v.subject, text: `${v.text}\n\n${footer.text}`,
          html: withFooter(v.html, footer.html), headers: { ...links.headers, ...languageHeaders(r.language) }, bulletinId,
        };
      }));
      await recordAudit(manager, {
        actorId: actor?.userId ?? null, action: 'bulletin.written', entity: 'bulletin', entityId: bulletinId,
        after: { districtId: d.district.id, epiYear: d.epiYear, epiWeek: d.epiWeek, recipients: n },
        reason: actor ? 'sent now from the Bulletin screen' : 'weekly schedule',
      });
      return n;
    });
  }
}
