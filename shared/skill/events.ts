/**
 * Events and null models for the skill scores (docs/skill.md). Pure functions, no I/O.
 */
import { endemicChannel, type ChannelBand, type ChannelMethod } from '../signals';
import type { ScoredWeek } from './scores';

/** One district's case counts, week by week (0-based index inside the season), per season. */
export interface SeasonCounts {
  season: string;
  counts: readonly (number | null)[];
}

export interface EventDefinition {
  method: ChannelMethod;
  /** Which line of the channel the count must exceed (strictly) to be an event. Default `upper`. */
  line?: keyof ChannelBand;
  /** Two-sided level of the geometric band (default 0.95). */
  level?: number;
}

/**
 * Event weeks of one district: a week is an event when its count is strictly above the chosen line
 * of the endemic channel of that week computed from the OTHER seasons (leave-one-season-out, so a
 * season's own epidemic does not raise its own threshold). Null when the count is missing or fewer
 * than two other seasons have that week.
 */
export function eventWeeks(seasons: readonly SeasonCounts[], def: EventDefinition): Map<string, (boolean | null)[]> {
  const line = def.line ?? 'upper';
  const out = new Map<string, (boolean | null)[]>();
  for (const s of seasons) {
    out.set(
      s.season,
      s.counts.map((count, week) => {
        if (count === null) return null;
        const history = seasons
          .filter((o) => o.season !== s.season)
          .map((o) => o.counts[week])
          .filter((c): c is number => c !== null && c !== undefined);
        if (history.length < 2) return null;
        const band = endemicChannel(def.method, history, { level: def.level });
        return count > band[line];
      }),
    );
  }
  return out;
}

const cellKey = (district: string, season: string, week: number) => `${district}\u0000${season}\u0000${week}`;

/**
 * Seasonal climatology on the same weeks: the score is the event frequency of the same district and
 * week in the other seasons (a probability in [0, 1]). Weeks without any other season score 0.
 */
export function climatologyModel(weeks: readonly ScoredWeek[]): ScoredWeek[] {
  const byCell = new Map<string, ScoredWeek[]>();
  for (const w of weeks) {
    const k = `${w.district}\u0000${w.week}`;
    byCell.set(k, [...(byCell.get(k) ?? []), w]);
  }
  return weeks.map((w) => {
    const others = byCell.get(`${w.district}\u0000${w.week}`)!.filter((o) => o.season !== w.season && o.event !== null);
    const score = others.length === 0 ? 0 : others.filter((o) => o.event).length / others.length;
    return { ...w, score };
  });
}

/**
 * Persistence: the score issued in week w is the event state of the last complete week, w − 1, in
 * the same district and season (1 or 0; 0 for the first week or an undecided week).
 */
export function persistenceModel(weeks: readonly ScoredWeek[]): ScoredWeek[] {
  const byKey = new Map(weeks.map((w) => [cellKey(w.district, w.season, w.week), w]));
  return weeks.map((w) => ({ ...w, score: byKey.get(cellKey(w.district, w.season, w.week - 1))?.event ? 1 : 0 }));
}

/**
 * The endemic channel alone, as it could be read in week w: the last complete week's count (w − 1)
 * divided by the upper line of its channel computed from the seasons BEFORE this one only (no
 * look-ahead). A score ≥ 1 means the count was above the channel. Seasons are taken in the given
 * order; null counts and weeks with fewer than two prior seasons score 0.
 */
export function channelAloneModel(
  district: string,
  seasons: readonly SeasonCounts[],
  def: EventDefinition,
  weeks: readonly ScoredWeek[],
): ScoredWeek[] {
  const ratio = new Map<string, number>();
  seasons.forEach((s, i) => {
    const prior = seasons.slice(0, i);
    s.counts.forEach((count, week) => {
      if (count === null) return;
      const history = prior.map((o) => o.counts[week]).filter((c): c is number => c !== null && c !== undefined);
      if (history.length < 2) return;
      const upper = endemicChannel(def.method, history, { level: def.level })[def.line ?? 'upper'];
      ratio.set(cellKey(district, s.season, week), upper > 0 ? count / upper : count > 0 ? Number.MAX_VALUE : 0);
    });
  });
  return weeks
    .filter((w) => w.district === district)
    .map((w) => ({ ...w, score: ratio.get(cellKey(district, w.season, w.week - 1)) ?? 0 }));
}
