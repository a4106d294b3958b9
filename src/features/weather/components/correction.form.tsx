import { useId, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import type { CorrectionBody, IssueDto } from '../../../../shared/api/weather.schema';
import { FormMessage, TextField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { useUnits } from '../../../lib/units';
import { useCorrectDay, useVoidDay } from '../api/correct.api';
import { VoidAction } from '../../../components/void-dialog';

/** A typed number ("21,5" is read as 21.5, so a decimal comma works too); null when empty, NaN when not a number. */
const parse = (s: string) => (s.trim() === '' ? null : Number(s.trim().replace(',', '.')));
const round2 = (x: number) => Math.round(x * 100) / 100;

/**
 * Correct one station-day; it goes through the same checks as an upload, and the old value stays in the
 * revisions. Temperatures and rain are typed in the user's display units (the labels say which) and sent
 * in °C and mm.
 */
export function CorrectionForm({ from, onDone }: { from: IssueDto | null; onDone?: () => void }) {
  // Two of these forms can be on the Intake screen at once (the report's and the one below it).
  const titleId = useId();
  const { t } = useTranslation('weather');
  const units = useUnits();
  const correct = useCorrectDay();
  const voidDay = useVoidDay();
  const [voided, setVoided] = useState(false);
  const [station, setStation] = useState(from?.station ?? '');
  const [date, setDate] = useState(from?.date ?? '');
  // Correct starts from every value of the row as stored (issue 21: RH and rain were saved empty unless retyped).
  const stored = from?.stored ?? null;
  const shown = (x: number | null | undefined, to: (v: number) => number) => (x === null || x === undefined ? '' : String(round2(to(x))));
  const [tmin, setTmin] = useState(shown(stored?.tmin, units.toTemperature));
  const [tmax, setTmax] = useState(shown(stored?.tmax, units.toTemperature));
  const [rh, setRh] = useState(shown(stored?.rh, (v) => v));
  const [rain, setRain] = useState(stored?.rain === null || stored?.rain === undefined ? '' : String(Math.round(units.toRain(stored.rain) * 1000) / 1000));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [outcome, setOutcome] = useState<{ kind: 'success' | 'error'; text: string } | null>(null);
  const labels = {
    station: t('correction.station'),
    date: t('correction.date'),
    tmin: t('correction.tmin', { unit: units.temperatureSymbol }),
    tmax: t('correction.tmax', { unit: units.temperatureSymbol }),
    rh: t('correction.rh'),
    rain: t('correction.rain', { unit: units.rainSymbol }),
  };

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setOutcome(null);
    const values = { tmin: parse(tmin), tmax: parse(tmax), rh: parse(rh), rain: parse(rain) };
    const problems: Record<string, string> = {};
    if (!station.trim()) problems.station = t('correction.required', { field: labels.station });
    if (!date.trim()) problems.date = t('correction.required', { field: labels.date });
    for (const k of ['tmin', 'tmax'] as const) if (values[k] === null) problems[k] = t('correction.required', { field: labels[k] });
    for (const k of ['tmin', 'tmax', 'rh', 'rain'] as const) if (values[k] !== null && Number.isNaN(values[k])) problems[k] = t('correction.notNumber', { field: labels[k] });
    setErrors(problems);
    if (Object.keys(problems).length) return;
    const body: CorrectionBody = {
      station: station.trim(),
      date: date.trim(),
      tmin: round2(units.fromTemperature(values.tmin!)),
      tmax: round2(units.fromTemperature(values.tmax!)),
      rh: values.rh,
      rain: values.rain === null ? null : round2(units.fromRain(values.rain)),
      tempUnit: 'C',
      rainUnit: 'mm',
    };
    try {
      const r = await correct.mutateAsync(body);
      setOutcome({ kind: 'success', text: r.rowsReplaced ? t('correction.savedKept') : t('correction.saved') });
      onDone?.();
    } catch (err) {
      setOutcome({ kind: 'error', text: isApiError(err) ? err.message : t('correction.failed') });
    }
  };

  return (
    <>
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={titleId}>
      <h3 id={titleId} className="section-title">
        {t('correction.title')}
      </h3>
      <p className="text-sm text-ink-muted">{t('correction.unitHint', { temperature: units.temperatureSymbol, rain: units.rainSymbol })}</p>
      {outcome ? <FormMessage kind={outcome.kind}>{outcome.text}</FormMessage> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField label={labels.station} value={station} onChange={(e) => setStation(e.currentTarget.value)} error={errors.station} required />
        <TextField label={labels.date} type="date" value={date} onChange={(e) => setDate(e.currentTarget.value)} error={errors.date} required />
        <TextField label={labels.tmin} inputMode="decimal" value={tmin} onChange={(e) => setTmin(e.currentTarget.value)} error={errors.tmin} required />
        <TextField label={labels.tmax} inputMode="decimal" value={tmax} onChange={(e) => setTmax(e.currentTarget.value)} error={errors.tmax} required />
        <TextField label={labels.rh} inputMode="decimal" value={rh} onChange={(e) => setRh(e.currentTarget.value)} error={errors.rh} />
        <TextField label={labels.rain} inputMode="decimal" value={rain} onChange={(e) => setRain(e.currentTarget.value)} error={errors.rain} />
      </div>
      <button type="submit" className="btn btn-primary btn-small" disabled={correct.isPending}>
        {correct.isPending ? t('correction.checking') : t('correction.submit')}
      </button>
    </form>
    {/* A day entered in error can be voided instead (never deleted): its values stay in the revisions. */}
    {station.trim() && /^\d{4}-\d{2}-\d{2}$/.test(date) ? (
      <div className="mt-3 space-y-2">
        {voided ? <FormMessage kind="success">{t('correction.voided', { date, station: station.trim() })}</FormMessage> : null}
        <VoidAction
          what={t('correction.voidWhat', { date, station: station.trim() })}
          onVoid={async (reason) => {
            await voidDay.mutateAsync({ station: station.trim(), date, reason });
            setVoided(true);
          }}
        />
      </div>
    ) : null}
    </>
  );
}
