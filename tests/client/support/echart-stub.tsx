/** Stands in for the ECharts drawing in happy-dom (no canvas): keeps the option for assertions. */
export function EChart({ option, height }: { option: unknown; height: string }) {
  const series = (option as { series?: { name?: string; data?: unknown[] }[] }).series ?? [];
  return (
    <div
      data-testid="echart-stub"
      data-height={height}
      data-series={JSON.stringify(series.map((s) => s.name ?? null))}
      data-largest={JSON.stringify(series.map((one) => largestDrawn(one)))}
    />
  );
}

/** The largest number a series would draw (a [x, y] pair counts its y), or null when none. */
function largestDrawn(s: { data?: unknown[] }): number | null {
  let largest: number | null = null;
  for (const point of s.data ?? []) {
    const y = Array.isArray(point) ? point[point.length - 1] : point && typeof point === 'object' ? (point as { value?: unknown }).value : point;
    if (typeof y === 'number' && (largest === null || y > largest)) largest = y;
  }
  return largest;
}
