import type { TFunction } from 'i18next';
import type { IssueDto, UploadDto } from '../../../shared/api/weather.schema';
import { FLAG_RULES, LIMITS, REJECT_RULES, toCelsius, toMillimetres } from '../../../shared/weather/qc';
import type { Formatters } from '../../i18n/format';
import type { Units } from '../../lib/units';

const TEMPERATURE_COLUMNS = new Set(['tmin', 'tmax', 'dewpoint']);
const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)$/;

/**
 * A row-report value in the user's display units. Rejected rows keep the text as it was in the file (in
 * the upload's units); flagged and filled rows hold the stored value (°C, mm). A value that is not a
 * number is shown as it is.
 */
export function issueValue(issue: IssueDto, upload: Pick<UploadDto, 'tempUnit' | 'rainUnit'>, units: Units, f: Formatters): string | null {
  const raw = issue.value;
  if (raw === null || !NUMBER.test(raw.trim())) return raw;
  const x = Number(raw.trim());
  const asStored = issue.severity !== 'rejected';
  if (TEMPERATURE_COLUMNS.has(issue.column)) {
    const c = asStored ? x : toCelsius(x, upload.tempUnit);
    return `${f.number(units.toTemperature(c), 1)} ${units.temperatureSymbol}`;
  }
  if (issue.column === 'rain') {
    const mm = asStored ? x : toMillimetres(x, upload.rainUnit);
    return `${f.number(units.toRain(mm), units.rainDigits)} ${units.rainSymbol}`;
  }
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
