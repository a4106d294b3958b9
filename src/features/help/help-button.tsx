import { useCallback, useEffect, useId, useLayoutEffect, useRef, useState, type FocusEvent, type KeyboardEvent, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { HELP_SOURCES, OWN_RULE, type HelpTopic } from './help-topics';
import './help.css';

export type { HelpTopic } from './help-topics';

const PANEL_WIDTH = 352; // 22rem; the panel narrows on small screens (help.css)
const MARGIN = 8;

/**
 * A small "?" beside a number: a real button (its accessible name says which number) that opens a short
 * explanation — what the number is, how it was computed, the source of the method and its caution. The
 * panel follows the button in the page, so Tab moves on naturally; it is placed with `position: fixed`
 * so a scrolling table does not clip it. Escape or the Close button closes it and puts focus back on the
 * "?"; a click elsewhere or moving focus out of it closes it too. Built of <span>s so it can sit inside
 * a paragraph or a table header.
 */
export function HelpButton({ topic, className }: { topic: HelpTopic; className?: string }) {
  const { t } = useTranslation('help');
  const id = useId();
  const [open, setOpen] = useState(false);
  const [place, setPlace] = useState<{ top: number; left: number; maxHeight: number } | null>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const panelRef = useRef<HTMLSpanElement>(null);
  const title = t(`topics.${topic}.title`);

  const close = useCallback((returnFocus: boolean) => {
    setOpen(false);
    if (returnFocus) buttonRef.current?.focus();
  }, []);

  useLayoutEffect(() => {
    if (!open) return;
    const position = () => {
      const r = buttonRef.current?.getBoundingClientRect();
      if (!r) return;
      const vw = window.innerWidth || document.documentElement.clientWidth || PANEL_WIDTH;
      const vh = window.innerHeight || document.documentElement.clientHeight || 768;
      const width = Math.min(PANEL_WIDTH, vw - 2 * MARGIN);
      const left = Math.max(MARGIN, Math.min(r.left, vw - width - MARGIN));
      // Below the "?" when it fits (or when there is more room below), else above it; never off screen.
      const height = panelRef.current?.scrollHeight ?? 0;
      const below = vh - r.bottom - 4 - MARGIN;
      const above = r.top - 4 - MARGIN;
      if (height > below && above > below) {
        const maxHeight = Math.max(120, above);
        setPlace({ top: Math.max(MARGIN, r.top - 4 - Math.min(height, maxHeight)), left, maxHeight });
      } else setPlace({ top: r.bottom + 4, left, maxHeight: Math.max(120, below) });
    };
    position();
    panelRef.current?.focus();
    window.addEventListener('resize', position);
    window.addEventListener('scroll', position, true);
    return () => {
      window.removeEventListener('resize', position);
      window.removeEventListener('scroll', position, true);
    };
  }, [open]);

  useEffect(() => {
    if (!open) return;
    const onPointerDown = (e: PointerEvent | MouseEvent) => {
      const target = e.target as Node | null;
      if (target && !panelRef.current?.contains(target) && !buttonRef.current?.contains(target)) close(false);
    };
    document.addEventListener('mousedown', onPointerDown);
    return () => document.removeEventListener('mousedown', onPointerDown);
  }, [open, close]);

  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape' && open) {
      e.stopPropagation();
      e.preventDefault();
      close(true);
    }
  };

  const onBlur = (e: FocusEvent) => {
    const next = e.relatedTarget as Node | null;
    if (next && !panelRef.current?.contains(next) && next !== buttonRef.current) close(false);
  };

  return (
    <span className={`help ${className ?? ''}`} onKeyDown={onKeyDown}>
      <button
        ref={buttonRef}
        type="button"
        className="help-button"
        aria-label={t('button', { topic: title })}
        aria-expanded={open}
        aria-haspopup="dialog"
        aria-controls={open ? `${id}-panel` : undefined}
        onClick={() => (open ? close(true) : setOpen(true))}
      />
      {open ? (
        <span
          ref={panelRef}
          id={`${id}-panel`}
          role="dialog"
          aria-modal="false"
          aria-labelledby={`${id}-title`}
          tabIndex={-1}
          className="help-panel"
          style={place ? { top: place.top, left: place.left, maxHeight: place.maxHeight } : undefined}
          onBlur={onBlur}
          data-help-topic={topic}
        >
          <span className="help-panel-head">
            <span id={`${id}-title`} className="help-panel-title">
              {title}
            </span>
            <button type="button" className="btn btn-quiet btn-small" onClick={() => close(true)}>
              {t('close')}
            </button>
          </span>
          <HelpPart label={t('what')}>{t(`topics.${topic}.what`)}</HelpPart>
          <HelpPart label={t('how')}>{t(`topics.${topic}.how`)}</HelpPart>
          <HelpPart label={t('source')}>
            {OWN_RULE.has(topic) ? <span className="help-part-line">{t('ownRule')}</span> : null}
            {HELP_SOURCES[topic].map((s) => (
              <span key={s} className="help-part-line help-source" lang="en">
                {s}
              </span>
            ))}
          </HelpPart>
          <HelpPart label={t('caution')}>{t(`topics.${topic}.caution`)}</HelpPart>
        </span>
      ) : null}
    </span>
  );
}

function HelpPart({ label, children }: { label: string; children: ReactNode }) {
  return (
    <span className="help-part">
      <strong className="help-part-label">{label}</strong>
      <span className="help-part-text">{children}</span>
    </span>
  );
}
