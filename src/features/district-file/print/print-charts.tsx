import { isOpenWeekAt, profileLabel } from '../district-file-format';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { useUnits } from '../../../lib/units';
import { useLadderWords } from '../../ladder/ladder-format';
import { AXIS_LIMITS, convertRange, withinAxis } from '../charts/axis-limits';
import { GREY, INDIGO, INDIGO_PALE, INK, lastIndexWithValue, MUTED } from '../charts/chart-style';

type Cases = DistrictFileResponse['cases'][number];
type VectorClock = DistrictFileResponse['vectorClock'][number];

const W = 640;
const H = 220;
const PAD = { left: 44, right: 12, top: 12, bottom: 28 };
const innerW = W - PAD.left - PAD.right;
const innerH = H - PAD.top - PAD.bottom;

/** A round top for an axis (1, 2, 5 × 10ⁿ) and its ticks. */
function niceTicks(max: number): number[] {
  if (!(max > 0)) return [0, 1];
  const step0 = max / 4;
  const mag = 10 ** Math.floor(Math.log10(step0));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= step0) ?? 10 * mag;
  const ticks: number[] = [];
  for (let v = 0; v <= max + step * 0.999; v += step) ticks.push(v);
  return ticks;
}

function Axes({ ticks, y, xLabels, unit }: { ticks: number[]; y: (v: number) => number; xLabels: { x: number; text: string }[]; unit: string }) {
  const { f } = useLadderWords();
  return (
    <g fontFamily="Lato, sans-serif" fontSize="10" fill={MUTED}>
      {ticks.map((v) => (
        <g key={v}>
          <line x1={PAD.left} x2={W - PAD.right} y1={y(v)} y2={y(v)} stroke="#d6d3cc" strokeDasharray="3 3" />
          <text x={PAD.left - 6} y={y(v) + 3} textAnchor="end">
            {f.number(v, 1)}
          </text>
        </g>
      ))}
      <text x={4} y={PAD.top + 2} fontSize="9">
        {unit}
      </text>
      <line x1={PAD.left} x2={W - PAD.right} y1={PAD.top + innerH} y2={PAD.top + innerH} stroke={GREY} />
      {xLabels.map((l) => (
        <text key={`${l.x}-${l.text}`} x={l.x} y={H - 8} textAnchor="middle">
          {l.text}
        </text>
      ))}
    </g>
  );
}

/**
 * Weekly cases against the endemic channel as a static drawing for paper: the channel band (lower to
 * upper), its centre as a dashed line, and this season's counts as bars. The table beside it on the
 * printable page holds the same numbers.
 */
export function PrintCasesChart({ cases, seasonYear }: { cases: Cases; seasonYear: number }) {
  const { t } = useLadderWords();
  const { weeks, counts, channel } = cases;
  const n = weeks.length;
  const max = Math.max(1, ...counts.map((c) => c ?? 0), ...channel.upper.map((c) => c ?? 0));
  const ticks = niceTicks(max);
  const top = ticks[ticks.length - 1];
  const y = (v: number) => PAD.top + innerH - (v / top) * innerH;
  const slot = innerW / Math.max(1, n);
  const x = (i: number) => PAD.left + slot * (i + 0.5);
  const band: string[] = [];
  weeks.forEach((_, i) => channel.upper[i] !== null && band.push(`${x(i)},${y(channel.upper[i]!)}`));
  for (let i = n - 1; i >= 0; i--) if (channel.lower[i] !== null) band.push(`${x(i)},${y(channel.lower[i]!)}`);
  const centre = weeks.map((_, i) => (channel.centre[i] === null ? null : `${x(i)},${y(channel.centre[i]!)}`)).filter(Boolean).join(' ');
  const every = Math.max(1, Math.ceil(n / 12));
  const xLabels = weeks.map((w, i) => ({ x: x(i), text: t('district-file:weekShort', { week: w }) })).filter((_, i) => i % every === 0);
  const label = t('district-file:print.casesChartLabel', { disease: cases.diseaseName, year: seasonYear });
  return (
    <figure className="print-figure">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="print-svg">
        <title>{label}</title>
        <Axes ticks={ticks} y={y} xLabels={xLabels} unit={t('district-file:cases.axis')} />
        {band.length > 2 ? <polygon points={band.join(' ')} fill={INDIGO_PALE} stroke={GREY} strokeWidth="0.8" /> : null}
        {counts.map((c, i) =>
          c === null ? null : isOpenWeekAt(cases, i) ? (
            // An open week (reporting not over): an outlined bar, its count partial.
            <rect key={i} x={x(i) - Math.min(10, slot * 0.3)} width={Math.min(20, slot * 0.6)} y={y(c)} height={PAD.top + innerH - y(c)} fill="none" stroke={INK} strokeWidth="1" strokeDasharray="3 2" />
          ) : (
            <rect key={i} x={x(i) - Math.min(10, slot * 0.3)} width={Math.min(20, slot * 0.6)} y={y(c)} height={PAD.top + innerH - y(c)} fill={INK} />
          ),
        )}
        {centre ? <polyline points={centre} fill="none" stroke={INDIGO} strokeWidth="1.5" strokeDasharray="5 3" /> : null}
      </svg>
      <figcaption className="print-legend">
        <span>
          <span className="legend-key legend-bar" aria-hidden="true" /> {t('district-file:cases.series.cases', { year: seasonYear })}
        </span>
        <span>
          <span className="legend-key legend-band" aria-hidden="true" /> {t('district-file:cases.series.band')}
        </span>
        <span>
          <span className="legend-key legend-dash" aria-hidden="true" /> {t('district-file:cases.series.centre')}
        </span>
      </figcaption>
    </figure>
  );
}

/** Cumulative degree-days since the biofix as a static line, in the user's units. */
export function PrintDegreeDaysChart({ vc }: { vc: VectorClock }) {
  const { t, f } = useLadderWords();
  const u = useUnits();
  // As on the screen: the axis ends where no season can reach (axis-limits.ts); beyond is not drawn but said.
  const { values, beyond } = withinAxis(
    vc.cumulativeDegreeDays.map((v) => (v === null ? null : u.toTemperatureDelta(v))),
    convertRange(AXIS_LIMITS.degreeDaysC, u.toTemperatureDelta),
  );
  const last = lastIndexWithValue(values);
  const beyondNote = beyond > 0 ? (
    <p className="text-sm text-ink-muted" data-beyond-axis={beyond}>
      {t('components:chart.beyondAxis', { count: beyond })}
    </p>
  ) : null;
  if (last < 0)
    return (
      <>
        <p className="text-sm text-ink-muted">{t('district-file:degreeDays.empty')}</p>
        {beyondNote}
      </>
    );
  const ticks = niceTicks(Math.max(1, ...values.map((v) => v ?? 0)));
  const top = ticks[ticks.length - 1];
  const n = vc.dates.length;
  const y = (v: number) => PAD.top + innerH - (v / top) * innerH;
  const x = (i: number) => PAD.left + (innerW * i) / Math.max(1, n - 1);
  const points = values.map((v, i) => (v === null ? null : `${x(i)},${y(v)}`)).filter(Boolean).join(' ');
  const every = Math.max(1, Math.ceil(n / 6));
  const xLabels = vc.dates.map((d, i) => ({ x: x(i), text: f.date(d) })).filter((_, i) => i % every === 0);
  const label = t('district-file:print.degreeDaysChartLabel', { profile: profileLabel({ t }, vc), unit: u.degreeDaySymbol });
  return (
    <figure className="print-figure">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="print-svg">
        <title>{label}</title>
        <Axes ticks={ticks} y={y} xLabels={xLabels} unit={u.degreeDaySymbol} />
        <polyline points={points} fill="none" stroke={INDIGO} strokeWidth="2" />
      </svg>
      {beyondNote}
    </figure>
  );
}
