/**
 * Shared look of the District file charts. Series are told apart by line style and symbol as well as by
 * colour (one deep indigo, ink, greys and the plum of the tier scale), so each chart reads in grayscale.
 */
export const INK = '#1d2026';
export const MUTED = '#575c66';
export const LINE = '#d6d3cc';
export const INDIGO = '#3a4890';
export const INDIGO_LIGHT = '#8c98cf';
export const INDIGO_PALE = 'rgba(140, 152, 207, 0.35)';
export const PLUM = '#94508a';
export const GREY = '#9a968d';

export const FONT = { fontFamily: 'Lato, sans-serif', color: INK };

/*
 * The legend takes the top line (it wraps to a second on a narrow screen: `type: 'scroll'` would hide
 * entries) and the axis titles sit on their own line under it, so the two never overlap.
 */
export const baseGrid = { left: 56, right: 60, top: 72, bottom: 36, containLabel: false } as const;
export const legend = { top: 0, left: 0, right: 0, textStyle: FONT, itemGap: 14 } as const;

export const timeAxis = {
  type: 'time' as const,
  axisLabel: { ...FONT, color: MUTED, hideOverlap: true },
  axisLine: { lineStyle: { color: GREY } },
  splitLine: { show: false },
};

export const valueAxis = (name: string, extra: Record<string, unknown> = {}) => ({
  type: 'value' as const,
  name,
  nameGap: 12,
  nameTextStyle: { ...FONT, color: MUTED },
  axisLabel: { ...FONT, color: MUTED },
  splitLine: { lineStyle: { color: LINE, type: 'dashed' as const } },
  ...extra,
});

export const categoryAxis = (data: string[]) => ({
  type: 'category' as const,
  data,
  axisLabel: { ...FONT, color: MUTED, hideOverlap: true },
  axisLine: { lineStyle: { color: GREY } },
});

export const axisTooltip = { trigger: 'axis' as const, confine: true, textStyle: FONT };

/** [date, value] pairs for a time axis. */
export const pairs = (dates: readonly string[], values: readonly (number | null)[]) =>
  dates.map((d, i) => [d, values[i] ?? null] as [string, number | null]);

export const round = (x: number | null | undefined, digits = 1) =>
  x === null || x === undefined || Number.isNaN(x) ? null : Math.round(x * 10 ** digits) / 10 ** digits;

export function maxOf(values: readonly (number | null)[]): { value: number; index: number } | null {
  let best: { value: number; index: number } | null = null;
  values.forEach((v, index) => {
    if (v !== null && (best === null || v > best.value)) best = { value: v, index };
  });
  return best;
}

export const lastIndexWithValue = (values: readonly (number | null)[]) => {
  for (let i = values.length - 1; i >= 0; i--) if (values[i] !== null) return i;
  return -1;
};

/** Every seventh day (and the last), so a table of a season stays readable. */
export const weeklyIndexes = (n: number) => {
  const out: number[] = [];
  for (let i = 0; i < n; i += 7) out.push(i);
  if (n > 0 && out[out.length - 1] !== n - 1) out.push(n - 1);
  return out;
};
