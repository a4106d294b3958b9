import { useId, useRef, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import type { DistrictDto } from '../../../../shared/api/districts.schema';
import { isApiError, type FieldProblem } from '../../../lib/api-client';
import { errorText, problemText } from '../../../lib/error-text';
import { FormMessage } from '../../../components/form';
import { useUploadBoundary } from '../api/upload-boundary.api';

const MAX_BYTES = 20 * 1024 * 1024;

type Outcome =
  | { kind: 'success'; text: string }
  | { kind: 'error'; text: string; problems?: FieldProblem[]; confirm?: { geojson: unknown; fileName: string } }
  | null;

/** The boundary checks' codes (server/districts/boundary-checks.ts), worded here with their parameters. */
const BOUNDARY_CODES = ['boundary_self_intersecting', 'boundary_invalid', 'boundary_coordinates_swapped', 'boundary_far_from_region'];

/** Reads a .geojson/.json file in the browser and sends its JSON as the district's boundary. */
export function BoundaryUploadForm({ district }: { district: DistrictDto }) {
  const { t } = useTranslation('districts');
  const upload = useUploadBoundary();
  const inputId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [outcome, setOutcome] = useState<Outcome>(null);

  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setFileError(null);
    setOutcome(null);
    const file = fileRef.current?.files?.[0];
    if (!file) {
      setFileError(t('boundary.chooseFile'));
      return;
    }
    if (file.size > MAX_BYTES) {
      setFileError(t('boundary.tooLarge', { file: file.name }));
      return;
    }
    let geojson: unknown;
    try {
      geojson = JSON.parse(await file.text());
    } catch {
      setFileError(t('boundary.notJson', { file: file.name }));
      return;
    }
    await send(geojson, file.name, false);
  };

  const send = async (geojson: unknown, fileName: string, confirm: boolean) => {
    setOutcome(null);
    try {
      await upload.mutateAsync({ id: district.id, geojson, confirm });
      setOutcome({ kind: 'success', text: t('boundary.saved', { file: fileName }) });
      if (fileRef.current) fileRef.current.value = '';
    } catch (error) {
      const known = isApiError(error) && BOUNDARY_CODES.includes(error.code);
      setOutcome({
        kind: 'error',
        text: isApiError(error)
          ? error.status === 413
            ? t('boundary.tooLargeForServer', { file: fileName })
            : t('boundary.refused', { file: fileName, reason: known ? t(`boundary.problems.${error.code}`, error.params) : errorText(error) })
          : t('boundary.failed'),
        problems: isApiError(error) && !known ? error.fields : undefined,
        confirm: isApiError(error) && error.params.confirmable === true ? { geojson, fileName } : undefined,
      });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={`boundary-${district.id}`}>
      <h4 id={`boundary-${district.id}`} className="font-bold">
        {t('boundary.title')}
      </h4>
      <p className="text-sm text-ink-muted">
        {district.hasBoundary ? t('boundary.onFile') : t('boundary.noneOnFile')} {t('boundary.format')}
      </p>
      {outcome ? (
        <FormMessage kind={outcome.kind}>
          <p>{outcome.text}</p>
          {outcome.kind === 'error' && outcome.problems?.length ? (
            <ul className="mt-2 list-disc pl-5 font-normal">
              {outcome.problems.map((p, i) => (
                <li key={i}>
                  {p.path ? <code className="font-mono text-sm">{p.path}</code> : null}
                  {p.path ? ': ' : null}
                  {problemText(p.message)}
                </li>
              ))}
            </ul>
          ) : null}
          {outcome.kind === 'error' && outcome.confirm ? (
            <div className="mt-3 space-y-2 font-normal">
              <p className="text-sm">{t('boundary.confirmHint')}</p>
              <button
                type="button"
                className="btn btn-secondary btn-small"
                disabled={upload.isPending}
                onClick={() => void send(outcome.confirm!.geojson, outcome.confirm!.fileName, true)}
              >
                {t('boundary.confirm')}
              </button>
            </div>
          ) : null}
        </FormMessage>
      ) : null}
      <div className="field">
        <label htmlFor={inputId} className="field-label">
          {t('boundary.file')}
        </label>
        <input
          id={inputId}
          ref={fileRef}
          type="file"
          className="input"
          accept=".geojson,.json,application/geo+json,application/json"
          aria-invalid={fileError ? true : undefined}
          aria-describedby={fileError ? `${inputId}-error` : undefined}
          onChange={() => setFileError(null)}
        />
        {fileError ? (
          <p id={`${inputId}-error`} className="field-error">
            {fileError}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn btn-primary btn-small" disabled={upload.isPending}>
        {upload.isPending ? t('boundary.uploading') : t('boundary.submit')}
      </button>
    </form>
  );
}
