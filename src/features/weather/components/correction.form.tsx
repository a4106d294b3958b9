import { useState, type FormEvent } from 'react';
import type { CorrectionBody, IssueDto } from '../../../../shared/api/weather.schema';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { useCorrectDay } from '../api/correct.api';

const num = (s: string) => (s.trim() === '' ? null : Number(s));

/** Correct one station-day; it goes through the same checks as an upload, and the old value stays in the revisions. */
export function CorrectionForm({ from, onDone }: { from: IssueDto | null; onDone?: () => void }) {
  const correct = useCorrectDay();
  const [station, setStation] = useState(from?.station ?? '');
  const [date, setDate] = useState(from?.date ?? '');
  const [tmin, setTmin] = useState('');
  const [tmax, setTmax] = useState('');
  const [rh, setRh] = useState('');
  const [rain, setRain] = useState('');
  const [tempUnit, setTempUnit] = useState<'C' | 'F'>('C');
  const [outcome, setOutcome] = useState<{ kind: 'success' | 'error'; text: string } | null>(null);

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setOutcome(null);
    const body: CorrectionBody = {
      station, date, tmin: Number(tmin), tmax: Number(tmax), rh: num(rh), rain: num(rain), tempUnit, rainUnit: 'mm',
    };
    try {
      const r = await correct.mutateAsync(body);
      setOutcome({ kind: 'success', text: r.rowsReplaced ? 'Saved. The earlier value is kept in the revisions.' : 'Saved.' });
      onDone?.();
    } catch (err) {
      setOutcome({ kind: 'error', text: isApiError(err) ? err.message : 'The correction could not be saved.' });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="correct-title">
      <h3 id="correct-title" className="section-title">
        Correct one day
      </h3>
      {outcome ? <FormMessage kind={outcome.kind}>{outcome.text}</FormMessage> : null}
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Station code" value={station} onChange={(e) => setStation(e.currentTarget.value)} required />
        <TextField label="Date" type="date" value={date} onChange={(e) => setDate(e.currentTarget.value)} required />
        <TextField label="Tmin" inputMode="decimal" value={tmin} onChange={(e) => setTmin(e.currentTarget.value)} required />
        <TextField label="Tmax" inputMode="decimal" value={tmax} onChange={(e) => setTmax(e.currentTarget.value)} required />
        <TextField label="RH (%)" inputMode="decimal" value={rh} onChange={(e) => setRh(e.currentTarget.value)} />
        <TextField label="Rain (mm)" inputMode="decimal" value={rain} onChange={(e) => setRain(e.currentTarget.value)} />
        <SelectField label="Temperature unit" value={tempUnit} onChange={(e) => setTempUnit(e.currentTarget.value as 'C' | 'F')}>
          <option value="C">°C</option>
          <option value="F">°F</option>
        </SelectField>
      </div>
      <button type="submit" className="btn btn-primary btn-small" disabled={correct.isPending}>
        {correct.isPending ? 'Checking…' : 'Save the correction'}
      </button>
    </form>
  );
}
