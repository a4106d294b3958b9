import type { DistrictFileResponse, DriverDto } from '../../../shared/api/board.schema';
import type { DriverId } from '../../../shared/tier';
import type { LadderWords } from '../ladder/ladder-format';

type TierWeek = DistrictFileResponse['tiers'][number];

/** The values behind each driver (the `detail` of a driver, from shared/tier/tier.ts) that have a plain name. */
const DETAIL_KEYS = new Set(['rvc14', 'seasonOpen', 'eipShare', 'generationsRatio', 'breteau', 'house', 'zone', 'aberrationAlarm', 'growthRatio', 'cases']);

/** "rvc14" → its plain name in the interface language; unknown keys are split into words ("someNewValue" → "Some new value"). */
export const detailLabel = (w: LadderWords, key: string) =>
  DETAIL_KEYS.has(key)
    ? w.t(`district-file:detail.${key}`)
    : key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/^./, (c) => c.toUpperCase()).replace(/ [A-Z]/g, (s) => s.toLowerCase());

export function detailValue(w: LadderWords, key: string, value: DriverDto['detail'][string]): string {
  if (value === null) return w.t('district-file:noData');
  if (typeof value === 'boolean') return value ? w.t('district-file:yes') : w.t('district-file:no');
  if (typeof value === 'number') return Number.isInteger(value) ? w.f.number(value) : w.f.number(value, 2, true);
  if (key === 'zone' && (value === 'below' || value === 'within' || value === 'above')) return w.t(`district-file:zoneInSentence.${value}`);
  return value;
}

/**
 * The notes on a tier's inputs, in the interface language. The season run stores them as English
 * sentences (shared/tier/tier.ts); the ones built from structured fields (a driver without data, no driver
 * at all) are rebuilt from those fields, the ages are read from the known sentences, and any other note
 * is shown as stored.
 */
export function tierNotes(w: LadderWords, tier: Pick<TierWeek, 'notes' | 'drivers' | 'confidence'>): string[] {
  const out: string[] = [];
  const missing = new Set<DriverId>(tier.drivers.filter((d) => d.score === null).map((d) => d.id));
  for (const note of tier.notes) {
    let m: RegExpExecArray | null;
    if (note === 'No driver has data yet: the tier cannot be estimated.') out.push(w.t('district-file:notes.noDriver'));
    else if ((m = /^(.+): no data; its weight is shared among the others\.$/.exec(note))) {
      const d = tier.drivers.find((x) => x.label === m![1] || x.id === m![1]);
      if (d) {
        out.push(w.t('district-file:notes.driverMissing', { driver: w.driver(d.id) }));
        missing.delete(d.id);
      } else out.push(note);
    } else if (note === 'No weather for this district.') out.push(w.t('district-file:notes.noWeather'));
    else if ((m = /^The newest weather is (\d+) days old\.$/.exec(note))) out.push(w.t('district-file:notes.weatherAge', { count: Number(m[1]) }));
    else if ((m = /^The newest case count is (\d+) weeks old\.$/.exec(note))) out.push(w.t('district-file:notes.caseAge', { count: Number(m[1]) }));
    else out.push(note);
  }
  // A driver without data that no stored note mentions still says so.
  for (const d of missing) if (tier.confidence !== 'insufficient') out.push(w.t('district-file:notes.driverMissing', { driver: w.driver(d) }));
  return out;
}

/** "Stations in the district: A, B" / "No station inside the district: interpolated from …" in the interface language. */
export function weatherSourceText(w: LadderWords, source: string | null): string {
  if (!source) return w.t('district-file:about.noSource');
  let m = /^Stations in the district: (.+)$/.exec(source);
  if (m) return w.t('district-file:about.sourceInside', { stations: m[1] });
  m = /^No station inside the district: interpolated from (.+)$/.exec(source);
  if (m) {
    const parts = m[1].split(/, (?=[^,()]+ \()/).map((p) => {
      const s = /^(.+) \((\d+) km, weight ([\d.]+)\)$/.exec(p);
      return s ? w.t('district-file:about.sourceStation', { station: s[1], km: w.f.number(Number(s[2])), weight: w.f.number(Number(s[3]), 2, true) }) : p;
    });
    return w.t('district-file:about.sourceInterpolated', { stations: parts.join(w.t('district-file:listSeparator')) });
  }
  return source;
}

/** The endemic channel's method name (a deployment setting) in the interface language; other text as stored. */
export const channelMethodText = (w: LadderWords, method: string) =>
  method === 'geometric' || method === 'quartile' || method === 'mean-2sd' ? w.t(`district-file:channelMethods.${method}`) : method;

export const fixed = (w: LadderWords, x: number | null, digits = 2) => w.f.number(x, digits, true);

/** A vector–pathogen profile's name in the interface language (the server's English name for a profile the client does not know). */
export const profileLabel = (w: Pick<LadderWords, 't'>, profile: { profileId: string; profileName: string }) =>
  w.t(`district-file:profileNames.${profile.profileId}`, { defaultValue: profile.profileName });

/** Whether week index `i` of a disease's season is still open for reporting (a partial count, no zone). */
export const isOpenWeekAt = (cases: { weeks: number[]; openFrom?: number | null }, i: number) =>
  cases.openFrom !== null && cases.openFrom !== undefined && cases.weeks[i] >= cases.openFrom;

/** The index of the newest complete week with a count (-1 when none): the headline figures read this week. */
export function lastCompleteIndex(cases: { weeks: number[]; counts: (number | null)[]; openFrom?: number | null }) {
  for (let i = cases.counts.length - 1; i >= 0; i--) if (cases.counts[i] !== null && !isOpenWeekAt(cases, i)) return i;
  return -1;
}

/** The newest open week with a count, as its index (-1 when none). */
export function lastOpenIndex(cases: { weeks: number[]; counts: (number | null)[]; openFrom?: number | null }) {
  for (let i = cases.counts.length - 1; i >= 0; i--) if (cases.counts[i] !== null && isOpenWeekAt(cases, i)) return i;
  return -1;
}

/**
 * Whether low, central and high estimates read the same to two decimals: they are then shown as one value
 * (a "low 0.27 – high 0.27" range says nothing and reads as a mistake).
 */
export const sameToTwoDecimals = (w: Pick<LadderWords, 'f'>, ...xs: (number | null | undefined)[]) =>
  xs.every((x) => x !== null && x !== undefined) && new Set(xs.map((x) => w.f.number(x, 2, true))).size === 1;
