import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import type { DriverId, Tier } from '../../../shared/tier';
import type { LadderRow } from '../../../shared/api/board.schema';
import { i18n } from '../../i18n';
import { formattersFor, useFormat, type Formatters } from '../../i18n/format';

export type ChannelZone = NonNullable<LadderRow['channelZone']>;
export type Confidence = LadderRow['confidence'];

/**
 * The words of the Ladder (tiers, drivers, zones, confidence marks, changes) in the interface language,
 * from the `ladder` namespace, and its numbers and dates through the locale formatters. Shared by the
 * Ladder, the region map, the District file and the printable page, so every screen names a tier alike.
 */
export interface LadderWords {
  t: TFunction;
  f: Formatters;
  tier: (tier: Tier) => string;
  /** '—' when there is no driver. */
  driver: (d: DriverId | null) => string;
  /** '—' when there is no zone. */
  zone: (z: ChannelZone | null) => string;
  /** The mark shown instead of a confident look when the tier rests on old or missing inputs (null: ok). */
  confidence: (c: Confidence) => string | null;
  /** "up 1", "down 2", "no change"; null (no tier last week) reads "new this week". */
  change: (steps: number | null) => string;
  /** "Raised–High" when the low and high estimates differ; null when they agree. */
  range: (row: Pick<LadderRow, 'tierLow' | 'tierHigh'>) => string | null;
  /** "week 22 of 2025" (inside a sentence); null without a week. */
  week: (year: number | null, week: number | null) => string | null;
  score: (x: number | null | undefined, digits?: number) => string;
  count: (x: number | null | undefined) => string;
  day: (iso: string | null | undefined) => string;
  dateTime: (iso: string | null | undefined) => string;
}

export function ladderWords(t: TFunction, f: Formatters): LadderWords {
  const tier = (x: Tier) => t(`ladder:tiers.${x}`);
  return {
    t,
    f,
    tier,
    driver: (d) => (d ? t(`ladder:drivers.${d}`) : '—'),
    zone: (z) => (z ? t(`ladder:zones.${z}`) : '—'),
    confidence: (c) => (c === 'ok' ? null : t(`ladder:confidence.${c}`)),
    change: (steps) => {
      if (steps === null) return t('ladder:change.new');
      if (steps === 0) return t('ladder:change.none');
      return steps > 0 ? t('ladder:change.up', { count: steps }) : t('ladder:change.down', { count: -steps });
    },
    range: (row) => (row.tierLow === row.tierHigh ? null : t('ladder:range', { low: tier(row.tierLow), high: tier(row.tierHigh) })),
    week: (year, week) => (year === null || week === null ? null : t('ladder:week', { week, year })),
    score: (x, digits = 2) => f.number(x, digits, true),
    count: (x) => f.number(x),
    day: (iso) => f.date(iso),
    dateTime: (iso) => f.dateTime(iso),
  };
}

/** The Ladder's words in the current interface language (re-renders when it changes). */
export function useLadderWords(): LadderWords {
  const { t } = useTranslation('ladder');
  const f = useFormat();
  return useMemo(() => ladderWords(t, f), [t, f]);
}

/** The same words outside React (CSV built from an event handler, tests), in the current language. */
export const currentLadderWords = (): LadderWords => ladderWords(i18n.getFixedT(null, 'ladder'), formattersFor(i18n.language));

/** An arrow for the eye; the words are what screen readers and the CSV get. */
export function tierChangeArrow(change: number | null): string {
  if (change === null) return '•';
  if (change === 0) return '→';
  return change > 0 ? '↑' : '↓';
}

/** A calendar day (YYYY-MM-DD) in the current interface language; kept for screens that import it. */
export const formatDay = (iso: string | null): string => formattersFor(i18n.language).date(iso);
/** An instant with the time of day in the current interface language. */
export const formatDateTime = (iso: string | null): string => formattersFor(i18n.language).dateTime(iso);
