/** Stands in for the ECharts drawing in happy-dom (no canvas): keeps the option for assertions. */
export function EChart({ option, height }: { option: unknown; height: string }) {
  return <div data-testid="echart-stub" data-height={height} data-series={JSON.stringify((option as { series?: { name?: string }[] }).series?.map((s) => s.name ?? null) ?? [])} />;
}
