import { useDeferredValue, useId, useMemo, useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { FieldError, type CheckboxOption } from './form';

/** How many choices show at once: a short list stays a plain list of checkboxes, a long one is searched. */
export const PICKER_SHOWN = 24;
/** How many chosen items show as chips before "and n more" (a regional officer may hold hundreds of districts). */
const CHIPS_SHOWN = 30;

const fold = (s: string) =>
  s
    .normalize('NFD')
    .replace(/\p{M}/gu, '')
    .toLowerCase();

/**
 * A choice of many items (3,000 districts of a country) that stays short on a phone: the chosen items as
 * chips, each with its remove button, then a search box and at most PICKER_SHOWN matching items as
 * checkboxes. A short list (the demo region's dozen districts) shows whole, as the checkbox group did.
 *
 * Hand-written rather than a combobox library: the form is a fieldset of real checkboxes and buttons, which
 * keyboard and screen readers already know, and no listbox/aria-activedescendant juggling is needed.
 */
export function SearchPicker({
  legend,
  options,
  value,
  onChange,
  error,
  hint,
  emptyText,
  disabled,
  shown = PICKER_SHOWN,
}: {
  legend: string;
  options: CheckboxOption[];
  value: string[];
  onChange: (next: string[]) => void;
  error?: string;
  hint?: ReactNode;
  emptyText?: string;
  disabled?: boolean;
  shown?: number;
}) {
  const id = useId();
  const { t, i18n } = useTranslation('components');
  const [query, setQuery] = useState('');
  const [allChips, setAllChips] = useState(false);
  const deferred = useDeferredValue(query);
  const count = (n: number) => new Intl.NumberFormat(i18n.language).format(n);
  const folded = useMemo(() => options.map((o) => ({ option: o, text: fold(`${o.label} ${o.value}`) })), [options]);
  const byValue = useMemo(() => new Map(options.map((o) => [o.value, o])), [options]);
  const chosen = useMemo(() => new Set(value), [value]);
  const searchable = options.length > shown;
  const matches = useMemo(() => {
    const words = fold(deferred).split(/\s+/).filter(Boolean);
    if (!words.length) return options;
    return folded.filter((f) => words.every((w) => f.text.includes(w))).map((f) => f.option);
  }, [deferred, folded, options]);
  const visible = searchable ? matches.slice(0, shown) : options;
  const toggle = (v: string, checked: boolean) => onChange(checked ? [...value.filter((x) => x !== v), v] : value.filter((x) => x !== v));
  const chips = allChips ? value : value.slice(0, CHIPS_SHOWN);
  const describedBy = [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

  return (
    <fieldset className="field search-picker" aria-describedby={describedBy} disabled={disabled}>
      <legend className="field-label">{legend}</legend>
      {hint ? (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      ) : null}
      {options.length === 0 ? (
        <p className="field-hint">{emptyText ?? t('checkboxGroup.empty')}</p>
      ) : (
        <>
          {searchable ? (
            <>
              <p className="text-sm" id={`${id}-chosen`} aria-live="polite">
                {t('picker.chosen', { count: value.length, n: count(value.length) })}
              </p>
              {value.length ? (
                <ul className="picker-chips" aria-labelledby={`${id}-chosen`}>
                  {chips.map((v) => {
                    const label = byValue.get(v)?.label ?? v;
                    return (
                      <li key={v} className="picker-chip">
                        <span className="min-w-0 truncate">{label}</span>
                        <button type="button" className="picker-chip-remove" aria-label={t('picker.remove', { label })} onClick={() => toggle(v, false)}>
                          <span aria-hidden="true">×</span>
                        </button>
                      </li>
                    );
                  })}
                  {value.length > CHIPS_SHOWN ? (
                    <li>
                      <button type="button" className="btn btn-secondary btn-small" onClick={() => setAllChips(!allChips)} aria-expanded={allChips}>
                        {allChips ? t('picker.fewerChosen') : t('picker.moreChosen', { n: count(value.length - CHIPS_SHOWN) })}
                      </button>
                    </li>
                  ) : null}
                  <li>
                    <button type="button" className="btn btn-secondary btn-small" onClick={() => onChange([])}>
                      {t('picker.clear')}
                    </button>
                  </li>
                </ul>
              ) : null}
              <div className="mt-2">
                <label htmlFor={`${id}-search`} className="field-label">
                  {t('picker.search', { legend })}
                </label>
                <input
                  id={`${id}-search`}
                  type="search"
                  className="input"
                  autoComplete="off"
                  spellCheck={false}
                  value={query}
                  onChange={(e) => setQuery(e.currentTarget.value)}
                  aria-describedby={`${id}-matches`}
                />
              </div>
              <p id={`${id}-matches`} className="field-hint" aria-live="polite">
                {matches.length === 0
                  ? t('picker.noMatch')
                  : matches.length > shown
                    ? t('picker.showing', { shown: count(shown), total: count(matches.length) })
                    : t('picker.matching', { count: matches.length, n: count(matches.length) })}
              </p>
            </>
          ) : null}
          {visible.length ? (
            <ul className="mt-1 grid grid-cols-1 gap-1 rounded-md border border-line bg-surface p-2 sm:grid-cols-2" data-testid="picker-options">
              {visible.map((o) => (
                <li key={o.value}>
                  <label className="flex cursor-pointer items-center gap-2 rounded px-1 py-1 hover:bg-accent-50">
                    <input type="checkbox" className="checkbox" checked={chosen.has(o.value)} onChange={(e) => toggle(o.value, e.currentTarget.checked)} />
                    <span className="min-w-0 break-words">{o.label}</span>
                  </label>
                </li>
              ))}
            </ul>
          ) : null}
        </>
      )}
      <FieldError id={`${id}-error`} label={legend} message={error} />
    </fieldset>
  );
}
