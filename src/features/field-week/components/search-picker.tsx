import { useId, useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FieldError } from '../../../components/form';

export interface PickerItem {
  id: string;
  label: string;
  /** Also searched (a district's code, a person's role). */
  detail?: string;
}

/** At most this many matches are drawn: the region may have thousands of districts. */
const SHOWN = 8;

/**
 * A searchable picker: type part of a name or code, pick from the first matches. Used for a team's base
 * district (one) and its members (several), where a plain list would have thousands of options.
 * Hand-written (a search box and a short list of buttons, about 60 lines) rather than a combobox package:
 * it needs no popup positioning, and stays usable by keyboard and on a 360 px phone as it is.
 */
export function SearchPicker({
  label,
  hint,
  items,
  value,
  onChange,
  multiple = false,
  error,
}: {
  label: string;
  hint?: string;
  items: PickerItem[];
  value: string[];
  onChange: (next: string[]) => void;
  multiple?: boolean;
  error?: string;
}) {
  const { t } = useTranslation('field-week');
  const id = useId();
  const [query, setQuery] = useState('');
  const byId = useMemo(() => new Map(items.map((i) => [i.id, i])), [items]);
  const matches = useMemo(() => {
    const q = query.trim().toLocaleLowerCase();
    if (!q) return [];
    return items.filter((i) => !value.includes(i.id) && `${i.label} ${i.detail ?? ''}`.toLocaleLowerCase().includes(q)).slice(0, SHOWN + 1);
  }, [items, query, value]);
  const pick = (itemId: string) => {
    onChange(multiple ? [...value, itemId] : [itemId]);
    setQuery('');
  };
  const chosen = value.map((v) => byId.get(v)).filter((x): x is PickerItem => x !== undefined);

  return (
    <div className="field" role="group" aria-labelledby={`${id}-label`}>
      <label id={`${id}-label`} htmlFor={id} className="field-label">{label}</label>
      {hint ? <p id={`${id}-hint`} className="field-hint">{hint}</p> : null}
      {chosen.length ? (
        <ul className="mb-2 flex flex-wrap gap-2" aria-label={t('picker.chosen', { label })}>
          {chosen.map((c) => (
            <li key={c.id} className="flex items-center gap-1 rounded-full border border-line bg-accent-50 px-3 py-1 text-sm">
              <span>{c.label}{c.detail ? <small className="text-ink-muted"> · {c.detail}</small> : null}</span>
              <button type="button" className="ml-1 px-1 font-bold" aria-label={t('picker.remove', { name: c.label })} onClick={() => onChange(value.filter((v) => v !== c.id))}>×</button>
            </li>
          ))}
        </ul>
      ) : null}
      <input
        id={id}
        type="search"
        className="input"
        autoComplete="off"
        placeholder={t('picker.placeholder')}
        value={query}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined}
        onChange={(e) => setQuery(e.currentTarget.value)}
        onKeyDown={(e) => {
          if (e.key === 'Enter') {
            e.preventDefault();
            if (matches.length === 1) pick(matches[0].id);
          }
        }}
      />
      {query.trim() ? (
        matches.length === 0 ? (
          <p className="field-hint">{t('picker.none')}</p>
        ) : (
          <ul className="mt-1 rounded-md border border-line bg-surface" aria-label={t('picker.matches', { label })}>
            {matches.slice(0, SHOWN).map((m) => (
              <li key={m.id}>
                <button type="button" className="block w-full px-3 py-2 text-left hover:bg-accent-50 focus:bg-accent-50" onClick={() => pick(m.id)}>
                  {m.label}{m.detail ? <small className="text-ink-muted"> · {m.detail}</small> : null}
                </button>
              </li>
            ))}
            {matches.length > SHOWN ? <li className="px-3 py-1 text-sm text-ink-muted">{t('picker.more')}</li> : null}
          </ul>
        )
      ) : null}
      <FieldError id={`${id}-error`} label={label} message={error} />
    </div>
  );
}
