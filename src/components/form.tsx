import { useId, type ComponentProps, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { fieldErrorText } from '../lib/error-text';

type FieldShellProps = {
  label: string;
  /** The raw message (from zod or the server); it is read after the label, in the interface language. */
  error?: string;
  hint?: ReactNode;
};

function describedBy(hintId: string, errorId: string, hint: unknown, error: unknown) {
  return [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
}

export function FieldError({ id, label, message }: { id: string; label: string; message?: string }) {
  useTranslation('app'); // shown again in the new language when it changes
  const text = fieldErrorText(label, message);
  if (!text) return null;
  return (
    <p id={id} className="field-error">
      {text}
    </p>
  );
}

export function TextField({ label, error, hint, className, ...input }: FieldShellProps & ComponentProps<'input'>) {
  const id = useId();
  return (
    <div className={className ?? 'field'}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      ) : null}
      <input
        id={id}
        className="input"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(`${id}-hint`, `${id}-error`, hint, error)}
        {...input}
      />
      <FieldError id={`${id}-error`} label={label} message={error} />
    </div>
  );
}

export function SelectField({
  label,
  error,
  hint,
  className,
  children,
  ...select
}: FieldShellProps & ComponentProps<'select'>) {
  const id = useId();
  return (
    <div className={className ?? 'field'}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      ) : null}
      <select
        id={id}
        className="input"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(`${id}-hint`, `${id}-error`, hint, error)}
        {...select}
      >
        {children}
      </select>
      <FieldError id={`${id}-error`} label={label} message={error} />
    </div>
  );
}

export type CheckboxOption = { value: string; label: string };

/** A multi-select as a group of checkboxes: readable, usable by keyboard and on a small phone. */
export function CheckboxGroup({
  legend,
  options,
  value,
  onChange,
  error,
  hint,
  emptyText,
  disabled,
}: {
  legend: string;
  options: CheckboxOption[];
  value: string[];
  onChange: (next: string[]) => void;
  error?: string;
  hint?: ReactNode;
  emptyText?: string;
  disabled?: boolean;
}) {
  const id = useId();
  const { t } = useTranslation('components');
  const toggle = (v: string, checked: boolean) =>
    onChange(checked ? [...value.filter((x) => x !== v), v] : value.filter((x) => x !== v));
  return (
    <fieldset className="field" aria-describedby={describedBy(`${id}-hint`, `${id}-error`, hint, error)} disabled={disabled}>
      <legend className="field-label">{legend}</legend>
      {hint ? (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      ) : null}
      {options.length === 0 ? (
        <p className="field-hint">{emptyText ?? t('checkboxGroup.empty')}</p>
      ) : (
        <ul className="mt-1 grid grid-cols-1 gap-1 rounded-md border border-line bg-surface p-2 sm:grid-cols-2">
          {options.map((o) => (
            <li key={o.value}>
              <label className="flex cursor-pointer items-center gap-2 rounded px-1 py-1 hover:bg-accent-50">
                <input
                  type="checkbox"
                  className="checkbox"
                  checked={value.includes(o.value)}
                  onChange={(e) => toggle(o.value, e.currentTarget.checked)}
                />
                <span>{o.label}</span>
              </label>
            </li>
          ))}
        </ul>
      )}
      <FieldError id={`${id}-error`} label={legend} message={error} />
    </fieldset>
  );
}

/** A message at the top of a form; announced to screen readers when it appears. */
export function FormMessage({ kind, children }: { kind: 'error' | 'success' | 'info'; children: ReactNode }) {
  if (!children) return null;
  return (
    <div role={kind === 'error' ? 'alert' : 'status'} className={`notice notice-${kind}`}>
      {children}
    </div>
  );
}
