import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { DriverResult } from '../../shared/tier';
import type { FlagReason } from '../../shared/api/flags.schema';
import { FlagEntity } from '../../server/flags/flag.entity';
import { actionsOf } from '../../server/flags/flag-texts';

/** An open flag written straight into the table (the season run and the API raise them for real elsewhere). */
export async function makeFlag(
  ds: DataSource,
  opts: {
    districtId: string; reason?: FlagReason; tier?: string | null; raisedBy?: string | null; createdAt?: Date;
    epiYear?: number; epiWeek?: number; runId?: string | null; drivers?: DriverResult[]; note?: string | null;
  },
) {
  const repo = ds.getRepository(FlagEntity);
  return repo.save(repo.create({
    districtId: opts.districtId,
    reason: opts.reason ?? 'manual',
    source: opts.reason && opts.reason !== 'manual' ? 'season-run' : 'manual',
    status: 'open',
    tier: opts.tier === undefined ? 'high' : opts.tier,
    previousTier: null,
    epiYear: opts.epiYear ?? 2026,
    epiWeek: opts.epiWeek ?? 33,
    runId: opts.runId ?? null,
    drivers: opts.drivers ?? [],
    suggestedMessage: 'Conditions favour mosquitoes in this test district; please act on the steps below.',
    actions: actionsOf(['source-reduction', 'case-finding']),
    note: opts.note === undefined ? 'made by a test' : opts.note,
    raisedBy: opts.raisedBy ?? null,
    ...(opts.createdAt ? { createdAt: opts.createdAt } : {}),
  }));
}

/** Drivers as the season run stores them, from contributions (score = contribution ÷ weight share, for the record only). */
export function makeDrivers(contributions: Partial<Record<DriverResult['id'], number>>, details: Partial<Record<DriverResult['id'], DriverResult['detail']>> = {}): DriverResult[] {
  const ids = ['climate', 'vectorClock', 'larval', 'cases'] as const;
  return ids.map((id) => ({
    id, label: id, weight: 0.25,
    score: contributions[id] === undefined ? null : Math.min(1, contributions[id]! * 4),
    contribution: contributions[id] ?? 0,
    detail: details[id] ?? {},
  }));
}

/** A district's tier for one week, as a season run writes it (district_tiers), with its run id. */
export async function makeTier(
  ds: DataSource,
  opts: { districtId: string; epiYear?: number; epiWeek: number; tier: string; drivers: DriverResult[]; runId?: string; computedAt?: Date },
): Promise<{ runId: string }> {
  const runId = opts.runId ?? randomUUID();
  const score = opts.drivers.reduce((a, d) => a + d.contribution, 0);
  await ds.query(
    `INSERT INTO district_tiers (district_id, epi_year, epi_week, run_id, computed_at, as_of, score, tier, tier_low, tier_high, confidence, drivers, notes)
     VALUES ($1, $2, $3, $4, $5, '2026-10-01', $6, $7, $7, $7, 'ok', $8, '[]')
     ON CONFLICT (district_id, epi_year, epi_week) DO UPDATE SET run_id = EXCLUDED.run_id, computed_at = EXCLUDED.computed_at, score = EXCLUDED.score,
       tier = EXCLUDED.tier, tier_low = EXCLUDED.tier, tier_high = EXCLUDED.tier, drivers = EXCLUDED.drivers`,
    [opts.districtId, opts.epiYear ?? 2026, opts.epiWeek, runId, opts.computedAt ?? new Date(), score, opts.tier, JSON.stringify(opts.drivers)],
  );
  return { runId };
}

const mailWeb = () => `http://127.0.0.1:${process.env.TEST_MAIL_WEB_PORT ?? '1081'}`;

export interface CaughtMailFull {
  id: string;
  subject: string;
  to: { address: string }[];
  text: string;
  html: string;
  headers: Record<string, string | string[]>;
  attachments?: { generatedFileName: string; contentType: string; fileName: string }[];
}

/** Every mail the test catcher holds for these addresses (the catcher is shared by all test files). */
export async function caughtFor(addresses: string[]): Promise<CaughtMailFull[]> {
  const res = await fetch(`${mailWeb()}/api/email`, { headers: { accept: 'application/json' } });
  const all = (await res.json()) as CaughtMailFull[];
  const wanted = new Set(addresses.map((a) => a.toLowerCase()));
  return all.filter((m) => m.to.some((t) => wanted.has(t.address.toLowerCase())));
}

/** Wait until the catcher holds at least `n` mails for the addresses. */
export async function waitForMails(addresses: string[], n: number, timeoutMs = 5_000): Promise<CaughtMailFull[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await caughtFor(addresses);
    if (found.length >= n || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A header of a caught mail, whatever the case of its name. */
export function header(mail: CaughtMailFull, name: string): string | undefined {
  const key = Object.keys(mail.headers ?? {}).find((k) => k.toLowerCase() === name.toLowerCase());
  const v = key ? mail.headers[key] : undefined;
  return Array.isArray(v) ? v.join(', ') : v;
}

/** The raw message as received (GET /api/email/:id/source), for headers maildev does not parse. */
export async function rawSource(mail: CaughtMailFull): Promise<string> {
  const res = await fetch(`${mailWeb()}/api/email/${mail.id}/source`);
  return res.text();
}

/** Download an attachment through maildev's API (GET /api/email/:id/attachment/:generatedFileName). */
export async function attachment(mail: CaughtMailFull, index = 0): Promise<Buffer> {
  const a = mail.attachments![index];
  const res = await fetch(`${mailWeb()}/api/email/${mail.id}/attachment/${encodeURIComponent(a.generatedFileName)}`);
  return Buffer.from(await res.arrayBuffer());
}

/** A PDF's page count from its page objects (pdfkit writes object dictionaries uncompressed). */
export const pdfPages = (pdf: Buffer) => (pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length;
