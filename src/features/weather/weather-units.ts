import type { TFunction } from 'i18next';
import type { IssueDto, UploadDto } from '../../../shared/api/weather.schema';
import { toCelsius, toMillimetres } from '../../../shared/units';
import { FLAG_RULES, issueValueUnit, LIMITS, REJECT_RULES } from '../../../shared/weather/qc';
import type { Formatters } from '../../i18n/format';
import type { Units } from '../../lib/units';

const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)$/;

/**
 * A row-report value in the user's display units (issueValueUnit says which units it is in). A value that
 * is not a number is shown as it is.
 */
export function issueValue(issue: IssueDto, upload: Pick<UploadDto, 'tempUnit' | 'rainUnit'>, units: Units, f: Formatters): string | null {
  const raw = issue.value;
  if (raw === null || !NUMBER.test(raw.trim())) return raw;
  const x = Number(raw.trim());
  const from = issueValueUnit(issue, upload);
  if (from?.kind === 'temperature') return `${f.number(units.toTemperature(toCelsius(x, from.unit)), 1)} ${units.temperatureSymbol}`;
  if (from?.kind === 'rain') return `${f.number(units.toRain(toMillimetres(x, from.unit)), units.rainDigits)} ${units.rainSymbol}`;
  if (issue.column === 'rh') return `${f.number(x, 1)} %`;
  return raw;
}

const KNOWN_RULES = { ...REJECT_RULES, ...FLAG_RULES } as Record<string, string>;

/**
 * Why a row was rejected or flagged, in the interface language (by the rule's stable id, limits in the
 * user's units). `detail` is the server's own sentence when it says more than the rule (the values, the
 * row of a duplicate): in English it replaces the rule's text; in other languages it is shown under it.
 */
export function issueReason(issue: IssueDto, units: Units, f: Formatters, t: TFunction<'weather'>, language: string): { text: string; detail: string | null } {
  if (issue.severity === 'held') return { text: heldReasonText(issue, units, f, t), detail: null };
  const worded = issue.params ? detailText(issue, units, f, t) : null;
  if (worded) return { text: worded, detail: null };
  const generic = KNOWN_RULES[issue.rule];
  if (!generic) return { text: issue.reason, detail: null };
  const specific = issue.reason !== generic;
  if (language.startsWith('en') && specific && issue.rule !== 'temp-limits' && issue.rule !== 'rain-limits') return { text: issue.reason, detail: null };
  const text = t(`report.rule.${issue.rule}`, {
    min: `${f.number(units.toTemperature(LIMITS.tempMinC), 0)} ${units.temperatureSymbol}`,
    max:
      issue.rule === 'rain-limits'
        ? `${f.number(units.toRain(LIMITS.rainMaxMm), units.rainDigits)} ${units.rainSymbol}`
        : `${f.number(units.toTemperature(LIMITS.tempMaxC), 0)} ${units.temperatureSymbol}`,
  });
  return { text, detail: specific && !language.startsWith('en') ? issue.reason : null };
}

/**
 * Why a row is held, in words, from its reason code and figures (docs/weather-intake.md § Plausibility):
 * the median of the sample and the modified z-score, and for a unit mix-up the value read in the other unit.
 */
export function heldReasonText(issue: IssueDto, units: Units, f: Formatters, t: TFunction<'weather'>): string {
  const p = issue.params ?? {};
  const num = (x: unknown) => (typeof x === 'number' ? x : Number.NaN);
  const temp = (x: unknown) => `${f.number(units.toTemperature(num(x)), 1)} ${units.temperatureSymbol}`;
  const isTemp = p.column !== 'rh';
  return t(`report.held.${issue.rule}`, {
    median: isTemp ? temp(p.median) : `${f.number(num(p.median), 0)} %`,
    z: f.number(num(p.z), 1),
    alternative: p.alternative === null || p.alternative === undefined ? '' : temp(p.alternative),
    defaultValue: t('report.held.unlike_station_history', { median: isTemp ? temp(p.median) : `${f.number(num(p.median), 0)} %`, z: f.number(num(p.z), 1) }),
  });
}

/** The rules whose line carries its figures as params (server/weather/weather-intake.service.ts, intake-reader.ts). */
const DETAILED_RULES = new Set(['jump', 'run', 'spatial', 'duplicate-row', 'column-count', 'field-too-long']);

/**
 * A flagged or rejected line's own figures worded in the interface language (temperatures stored in °C,
 * shown in the user's units, numbers by locale), or null when the line has no figures (older intakes:
 * their English sentence is then shown as it was).
 */
export function detailText(issue: IssueDto, units: Units, f: Formatters, t: TFunction<'weather'>): string | null {
  const p = issue.params ?? {};
  if (!DETAILED_RULES.has(issue.rule)) return null;
  const num = (x: unknown) => (typeof x === 'number' ? x : Number.NaN);
  if (Object.values(p).some((v) => typeof v !== 'number')) return null;
  const temp = (x: unknown) => `${f.number(units.toTemperature(num(x)), 1)} ${units.temperatureSymbol}`;
  // A limit is a difference of temperatures: scaled, not shifted.
  const diff = (x: unknown) => `${f.number(units.toTemperatureDelta(num(x)), 1)} ${units.temperatureSymbol}`;
  return t(`report.detail.${issue.rule}`, {
    ptmin: temp(p.ptmin), tmin: temp(p.tmin), ptmax: temp(p.ptmax), tmax: temp(p.tmax), etmin: temp(p.etmin), etmax: temp(p.etmax),
    limit: issue.rule === 'run' ? f.number(num(p.limit), 0) : diff(p.limit),
    days: f.number(num(p.days), 0), count: num(p.days),
    first: f.number(num(p.first), 0),
    fields: f.number(num(p.fields), 0), expected: f.number(num(p.expected), 0),
    length: f.number(num(p.length), 0), max: f.number(num(p.max), 0),
  });
}
