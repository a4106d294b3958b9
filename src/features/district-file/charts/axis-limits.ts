import { EIP_MAX_DAYS } from '../../../../shared/model/traits';

/** A closed range an axis may show; values outside it are not drawn and are counted as "beyond the axis". */
export interface AxisRange {
  min: number;
  max: number;
}

/**
 * Hottest and coldest surface air temperatures ever recorded: 56.7 °C (Furnace Creek, Death Valley,
 * 10 July 1913) and −89.2 °C (Vostok station, 21 July 1983), WMO World Weather and Climate Extremes
 * Archive (World Meteorological Organization, 2023). A temperature outside cannot be meant; the intake
 * itself rejects beyond −90/60 °C (shared/weather/qc.ts LIMITS, rounded outwards), so the chart is the
 * narrower of the two.
 */
export const TEMPERATURE_RECORD_C: AxisRange = { min: -89.2, max: 56.7 };

/** Plausible ranges of the District file's axes, in stored (SI) units. */
export const AXIS_LIMITS = {
  temperatureC: TEMPERATURE_RECORD_C,
  /** Relative humidity is a percentage by definition. */
  percent: { min: 0, max: 100 },
  /**
   * The extrinsic incubation period: at most a season (EIP_MAX_DAYS, the model's own bound in
   * shared/model/traits.ts); longer ones are "not completed in a mosquito's life", never a number.
   */
  eipDays: { min: 0, max: EIP_MAX_DAYS },
  /**
   * Degree-days accumulated since the biofix: each day adds at most the day's mean above the lower
   * threshold (≥ 0 °C), itself below the warmest temperature on record, so a season of 366 days holds at
   * most 366 × 56.7 ≈ 20 752 °C·d (derived).
   */
  degreeDaysC: { min: 0, max: 366 * TEMPERATURE_RECORD_C.max },
} as const satisfies Record<string, AxisRange>;

/** Whether a value lies outside the range (or is not a finite number at all). */
export const isBeyond = (v: number, range: AxisRange) => !Number.isFinite(v) || v < range.min || v > range.max;

/**
 * The values an axis may draw: those beyond its range become null (a gap in the line, never a line shot
 * off to 10¹⁹), and how many there were, for the chart's "N values beyond the axis" note.
 */
export function withinAxis(values: readonly (number | null)[], range: AxisRange): { values: (number | null)[]; beyond: number } {
  let beyond = 0;
  const out = values.map((v) => {
    if (v === null) return null;
    if (isBeyond(v, range)) {
      beyond += 1;
      return null;
    }
    return v;
  });
  return { values: out, beyond };
}

/** A range in SI carried into the user's units by a monotonic conversion (°C → °F, mm → in). */
export const convertRange = (range: AxisRange, to: (x: number) => number): AxisRange => {
  const a = to(range.min);
  const b = to(range.max);
  return { min: Math.min(a, b), max: Math.max(a, b) };
};

