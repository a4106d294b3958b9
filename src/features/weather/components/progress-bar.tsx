import { useFormat } from '../../../i18n/format';

/** A labelled progress bar (native <progress>, so assistive technology reads the value). */
export function ProgressBar({ label, value, max, detail }: { label: string; value: number; max: number; detail?: string }) {
  const { percent } = useFormat();
  const pct = max > 0 ? Math.min(100, Math.round((value / max) * 100)) : 0;
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-sm">
        <span className="font-bold">{label}</span>
        <span className="tabular-nums text-ink-muted">{detail ?? percent(pct / 100)}</span>
      </div>
      <progress className="h-3 w-full accent-[var(--color-accent-700)]" value={pct} max={100} aria-label={label}>
        {percent(pct / 100)}
      </progress>
    </div>
  );
}
