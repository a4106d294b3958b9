/**
 * Heat accumulation over a season from a biofix date, with gaps kept in view.
 *
 * Rule: a day whose degree-days are null (a gap in the weather) adds nothing and is NOT read as zero
 * heat: its own value stays null and the running total is marked `complete: false` from that day on
 * (the total then is a lower bound). Days before the biofix carry a total of 0 and do not affect
 * completeness. Short gaps are filled by the weather intake before the model sees them; such days
 * come with `filled: true`, count normally, and the flag is carried through.
 */

export interface AccumulateInputDay {
  date: string;
  degreeDays: number | null;
  filled?: boolean;
}

export interface AccumulatedDay {
  date: string;
  degreeDays: number | null;
  /** Sum of the known degree-days from the biofix to this day (0 before the biofix). */
  cumulative: number;
  /** False once any day from the biofix to this day was a gap. */
  complete: boolean;
  /** True on and after the biofix date. */
  sinceBiofix: boolean;
  filled: boolean;
}

/** Accumulate degree-days from `biofix` (YYYY-MM-DD; days must be in date order). */
export function accumulate(days: readonly AccumulateInputDay[], biofix: string): AccumulatedDay[] {
  let total = 0;
  let complete = true;
  const out: AccumulatedDay[] = new Array(days.length);
  for (let i = 0; i < days.length; i++) {
    const d = days[i];
    const since = d.date >= biofix; // ISO dates compare as strings
    const v = d.degreeDays === null || Number.isNaN(d.degreeDays) ? null : d.degreeDays;
    if (since) {
      if (v === null) complete = false;
      else total += v;
    }
    out[i] = { date: d.date, degreeDays: v, cumulative: since ? total : 0, complete, sinceBiofix: since, filled: d.filled === true };
  }
  return out;
}
