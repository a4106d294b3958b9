import { useId, useRef, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import type { ImportProblem } from '../../../../shared/api/imports.schema';
import type { DistrictImportReport } from '../../../../shared/api/imports.schema';
import { FormMessage } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { ImportRefused, useRunImport, type ImportKind } from '../api/run-import.api';

const KINDS: ImportKind[] = ['districts', 'stations', 'populations'];
const MAPPING = ['codeProperty', 'nameProperty', 'parentCodeProperty', 'parentNameProperty', 'populationProperty', 'populationYear', 'objectName'] as const;

/**
 * The three imports (docs/import.md) as file uploads: "Check" runs the dry run and shows the first rows,
 * the field mapping and the problems; "Import" then writes the file (optionally leaving the problems out).
 */
export function ImportForm() {
  const { t } = useTranslation('districts');
  const run = useRunImport();
  const id = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<ImportKind>('districts');
  const [mapping, setMapping] = useState<Record<string, string>>({ codeProperty: 'code', nameProperty: 'name' });
  const [report, setReport] = useState<DistrictImportReport | null>(null);
  const [checked, setChecked] = useState<File | null>(null);
  const [skip, setSkip] = useState(false);
  const [message, setMessage] = useState<{ kind: 'success' | 'error'; text: string } | null>(null);

  const go = async (dryRun: boolean) => {
    setMessage(null);
    const file = dryRun ? fileRef.current?.files?.[0] : checked;
    if (!file) return setMessage({ kind: 'error', text: t('import.chooseFile') });
    try {
      const r = await run.mutateAsync({ kind, file, fields: kind === 'districts' ? mapping : {}, dryRun, skipProblems: skip });
      setReport(r);
      if (dryRun) setChecked(file);
      else {
        setChecked(null);
        setMessage({ kind: 'success', text: t('import.done', { created: r.created, updated: r.updated, skipped: r.skipped }) });
      }
    } catch (error) {
      if (error instanceof ImportRefused && error.report) setReport(error.report);
      setMessage({ kind: 'error', text: errorText(error) });
    }
  };

  const onCheck = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    void go(true);
  };

  const columns = report?.preview[0] ? Object.keys(report.preview[0]) : [];
  return (
    <form onSubmit={onCheck} noValidate className="space-y-3" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-bold">{t('import.title')}</h3>
      <p className="text-sm text-ink-muted">{t('import.lead')}</p>
      <div className="field">
        <label htmlFor={`${id}-kind`} className="field-label">{t('import.kind')}</label>
        <select id={`${id}-kind`} className="input" value={kind} onChange={(e) => { setKind(e.target.value as ImportKind); setReport(null); setChecked(null); }}>
          {KINDS.map((k) => <option key={k} value={k}>{t(`import.kinds.${k}`)}</option>)}
        </select>
        <p className="text-sm text-ink-muted">{t(`import.formats.${kind}`)}</p>
      </div>
      {kind === 'districts' ? (
        <fieldset className="grid gap-2 sm:grid-cols-2">
          <legend className="field-label">{t('import.mapping')}</legend>
          {MAPPING.map((m) => (
            <div className="field" key={m}>
              <label htmlFor={`${id}-${m}`} className="field-label">{t(`import.fields.${m}`)}</label>
              <input id={`${id}-${m}`} className="input" value={mapping[m] ?? ''} onChange={(e) => setMapping({ ...mapping, [m]: e.target.value })} />
            </div>
          ))}
        </fieldset>
      ) : null}
      <div className="field">
        <label htmlFor={`${id}-file`} className="field-label">{t('import.file')}</label>
        <input id={`${id}-file`} ref={fileRef} type="file" className="input" onChange={() => { setChecked(null); setReport(null); }}
          accept={kind === 'districts' ? '.geojson,.topojson,.json' : '.csv,.txt'} />
      </div>
      <button type="submit" className="btn btn-secondary btn-small" disabled={run.isPending}>{t('import.check')}</button>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      {report ? (
        <div className="space-y-2" aria-live="polite">
          <p>{t(report.dryRun ? 'import.summaryDry' : 'import.summary', { total: report.total, created: report.created, updated: report.updated, skipped: report.skipped })}</p>
          {report.properties.length ? <p className="text-sm">{t('import.properties', { names: report.properties.join(', ') })}</p> : null}
          {columns.length ? (
            <div className="overflow-x-auto">
              <table className="text-sm">
                <caption className="text-left font-bold">{t('import.preview')}</caption>
                <thead><tr>{columns.map((c) => <th key={c} scope="col" className="px-2 text-left">{c}</th>)}</tr></thead>
                <tbody>
                  {report.preview.map((row, i) => (
                    <tr key={i}>{columns.map((c) => <td key={c} className="px-2">{row[c] ?? ''}</td>)}</tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
          {report.problems.length ? (
            <div>
              <p className="font-bold">{t('import.problems', { n: report.problems.length + report.problemsNotListed })}</p>
              <ul className="list-disc pl-5 text-sm">
                {report.problems.slice(0, 50).map((p) => (
                  <li key={`${p.index}-${p.rule}`}>{t('import.problem', { index: p.index, code: p.code ?? '—', reason: problemText(t, p) })}</li>
                ))}
              </ul>
              <label className="mt-2 flex items-center gap-2 text-sm">
                <input type="checkbox" checked={skip} onChange={(e) => setSkip(e.target.checked)} />
                {t('import.skipProblems')}
              </label>
            </div>
          ) : null}
          {report.dryRun && checked ? (
            <button type="button" className="btn btn-primary btn-small" disabled={run.isPending || (report.problems.length > 0 && !skip)} onClick={() => void go(false)}>
              {run.isPending ? t('import.importing') : t('import.submit')}
            </button>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}

/**
 * An import problem in the person's language: the server sends only the rule code and its parameters. A CSV
 * line's repeated code names a line, a feature's another feature; a rule this client does not know yet is
 * still shown by its code.
 */
export function problemText(t: TFunction, p: Pick<ImportProblem, 'rule' | 'params'>): string {
  const rule = p.rule === 'code_repeated' && 'line' in p.params ? 'code_repeated_csv' : p.rule;
  return t([`districts:import.rules.${rule}`, 'districts:import.rules.other'], { ...p.params, rule: p.rule });
}
