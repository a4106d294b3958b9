import type { DriverDto } from '../../shared/api/board.schema';
import { type ActionDto } from '../../shared/api/flags.schema';
import type { Tier } from '../../shared/tier';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../app-context';
import type { Principal } from '../auth/principal';
import { presentBoard } from '../board/board.presenter';
import { BoardRepository } from '../board/board.repository';
import { DistrictFileService } from '../board/district-file.service';
import { type AdvisoryMessage } from '../../shared/api/flags.schema';
import { actionsOf } from '../flags/flag-texts';
import { ADVISORY_MESSAGE_COLUMNS, advisoryComposed, type AdvisoryMessageRecord } from '../flags/flags.presenter';
import type { Language } from '../i18n';
import { BulletinTranslationEntity } from './bulletin-translation.entity';
import { bulletinHtml, bulletinPdf, bulletinSubject, bulletinText } from './bulletin.render';

export interface CaseWeek {
  week: number;
  count: number | null;
  lower: number | null;
  centre: number | null;
  upper: number | null;
  /** Reporting for this week is still open (deadline not passed, not closed): the count is partial and gets no zone. */
  open: boolean;
}

/** Everything one district's bulletin says, read from stored results (nothing is recomputed). */
export interface BulletinData {
  district: { id: string; code: string; name: string; isDemo: boolean };
  epiYear: number;
  epiWeek: number;
  asOf: string | null;
  tier: { tier: Tier; tierLow: Tier; tierHigh: Tier; score: number; confidence: string; drivers: DriverDto[]; notes: string[] } | null;
  ranking: { rank: number; code: string; name: string; tier: Tier; score: number; confidence: string; isThis: boolean }[];
  tierHistory: { week: number; tier: Tier; score: number }[];
  cases: { diseaseName: string; weeks: CaseWeek[] }[];
  /** Open advisories; `composed` is the message as code and numbers (worded in the reader's language), null for an old one a person wrote. */
  advisories: { issuedAt: string; tier: Tier | null; message: string; composed: AdvisoryMessage | null }[];
  actions: ActionDto[];
}

/** The District file service reads as an admin would; the bulletin is written by the system, not a person. */
const SYSTEM: Principal = { userId: '00000000-0000-0000-0000-000000000000', sessionId: '', email: '', displayName: 'Broodcast', role: 'admin', districtIds: [] };

/** What to do at each tier, in the bulletin (advisories carry their own, chosen at sign-off). */
export function actionsForTier(tier: Tier | null): ActionDto[] {
  if (!tier || tier === 'baseline') return actionsOf(['source-reduction']);
  if (tier === 'raised') return actionsOf(['source-reduction', 'larval-survey']);
  if (tier === 'high') return actionsOf(['source-reduction', 'community-clean-up', 'larval-survey']);
  return actionsOf(['source-reduction', 'community-clean-up', 'larval-survey', 'case-finding']);
}

export class BulletinDataReader {
  private readonly board: BoardRepository;
  private readonly files: DistrictFileService;

  constructor(private readonly ctx: AppContext) {
    this.board = new BoardRepository(ctx.ds);
    this.files = new DistrictFileService(ctx);
  }

  /** The Ladder as it stands: its week, and every district ranked. */
  async ranking() {
    return presentBoard(await this.board.rows());
  }

  async read(districtId: string, board?: Awaited<ReturnType<BulletinDataReader['ranking']>>): Promise<BulletinData | null> {
    const ladder = board ?? (await this.ranking());
    if (ladder.epiYear === null || ladder.epiWeek === null) return null;
    const file = await this.files.file(SYSTEM, districtId, ladder.epiYear);
    const week = ladder.epiWeek;
    const tierRow = file.tiers.find((t) => t.epiYear === ladder.epiYear && t.epiWeek === week) ?? null;
    const advisories: (AdvisoryMessageRecord & { issued_at: Date; tier: Tier | null })[] = await this.ctx.ds.query(
      `SELECT a.issued_at, a.tier, ${ADVISORY_MESSAGE_COLUMNS}
         FROM advisories a JOIN districts d ON d.id = a.district_id LEFT JOIN flags f ON f.id = a.flag_id
        WHERE a.district_id = $1 AND a.expires_at > now() ORDER BY a.issued_at DESC`,
      [districtId],
    );
    const cases = file.cases
      .map((c) => ({
        diseaseName: c.diseaseName,
        weeks: c.weeks.filter((w) => w <= week).map((w, i) => ({
          week: w, count: c.counts[i], lower: c.channel.lower[i], centre: c.channel.centre[i], upper: c.channel.upper[i],
          open: c.openFrom !== null && w >= c.openFrom,
        })),
      }))
      // The disease with the most cases in the bulletin's week first.
      .sort((a, b) => (b.weeks[week - 1]?.count ?? -1) - (a.weeks[week - 1]?.count ?? -1));
    return {
      district: { id: file.district.id, code: file.district.code, name: file.district.name, isDemo: file.district.isDemo },
      epiYear: ladder.epiYear,
      epiWeek: week,
      asOf: ladder.asOf,
      tier: tierRow
        ? { tier: tierRow.tier, tierLow: tierRow.tierLow, tierHigh: tierRow.tierHigh, score: tierRow.score, confidence: tierRow.confidence, drivers: tierRow.drivers, notes: tierRow.notes }
        : null,
      ranking: ladder.rows.map((r) => ({ rank: r.rank, code: r.code, name: r.name, tier: r.tier, score: r.score, confidence: r.confidence, isThis: r.districtId === districtId })),
      tierHistory: file.tiers.filter((t) => t.epiWeek <= week).map((t) => ({ week: t.epiWeek, tier: t.tier, score: t.score })),
      cases,
      advisories: advisories.map((a) => ({
        issuedAt: new Date(a.issued_at).toISOString(), tier: a.tier, message: a.message, composed: advisoryComposed(a),
      })),
      actions: actionsForTier(tierRow?.tier ?? null),
    };
  }
}

/** One bulletin as written in one language. */
export interface BulletinVersion {
  language: Language;
  subject: string;
  html: string;
  text: string;
  pdf: Buffer;
}

export async function renderBulletin(d: BulletinData, language: Language): Promise<BulletinVersion> {
  return { language, subject: bulletinSubject(d, language), html: bulletinHtml(d, language), text: bulletinText(d, language), pdf: await bulletinPdf(d, language) };
}

/**
 * The bulletin in every language its recipients read, in the caller's transaction: the default
 * version is the `bulletins` row itself; each other language is written to bulletin_translations.
 */
export async function bulletinVersions(
  manager: EntityManager, bulletinId: string, d: BulletinData, base: BulletinVersion, languages: Language[],
): Promise<Map<Language, BulletinVersion>> {
  const out = new Map<Language, BulletinVersion>([[base.language, base]]);
  for (const language of new Set(languages)) {
    if (out.has(language)) continue;
    const v = await renderBulletin(d, language);
    await manager.insert(BulletinTranslationEntity, { bulletinId, language, subject: v.subject, html: v.html, text: v.text, pdf: v.pdf });
    out.set(language, v);
  }
  return out;
}
