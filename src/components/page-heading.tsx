import type { ReactNode } from 'react';
import { useDocumentTitle } from '../lib/document-title';

/**
 * The one h1 of a screen; `id="page-title"` labels the screen's section. A plain-text heading also
 * names the browser tab ("Users · Broodcast"); pass `documentTitle` when the heading holds markup.
 */
export function PageHeading({ children, lead, documentTitle }: { children: ReactNode; lead?: ReactNode; documentTitle?: string }) {
  useDocumentTitle(documentTitle ?? (typeof children === 'string' ? children : null));
  return (
    <header className="mb-6">
      <h1 id="page-title" className="text-2xl font-bold tracking-tight text-ink sm:text-3xl">
        {children}
      </h1>
      {lead ? <p className="mt-2 max-w-prose text-ink-muted">{lead}</p> : null}
    </header>
  );
}
