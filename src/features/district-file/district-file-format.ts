import type { DriverDto } from '../../../shared/api/board.schema';

/** Plain names of the values behind each driver (the `detail` of a driver, from shared/tier/tier.ts). */
const DETAIL_LABELS: Record<string, string> = {
  rvc14: 'Relative vectorial capacity, mean of the last 14 days',
  seasonOpen: 'Season window open',
  eipShare: 'Share of the EIP completed within the expected life',
  generationsRatio: 'Generations against the usual by this date',
  breteau: 'Breteau index',
  house: 'House index (%)',
  zone: 'Endemic channel zone',
  aberrationAlarm: 'Aberration test alarm',
  growthRatio: 'Cases this week ÷ last week',
  cases: 'Cases this week',
};

const ZONE_WORDS: Record<string, string> = { below: 'below the channel', within: 'within the channel', above: 'above the channel' };

/** "rvc14" → its plain name; unknown keys are split into words ("someNewValue" → "some new value"). */
export const detailLabel = (key: string) =>
  DETAIL_LABELS[key] ?? key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/^./, (c) => c.toUpperCase()).replace(/ [A-Z]/g, (s) => s.toLowerCase());

export function detailValue(key: string, value: DriverDto['detail'][string]): string {
  if (value === null) return 'no data';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return Number.isInteger(value) ? value.toLocaleString('en-GB') : value.toFixed(2);
  if (key === 'zone') return ZONE_WORDS[value] ?? value;
  return value;
}

export const fixed = (x: number | null, digits = 2) => (x === null ? '—' : x.toFixed(digits));
