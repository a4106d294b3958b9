import type { ReactNode } from 'react';

/** The one h1 of a screen; `id="page-title"` labels the screen's section. */
export function PageHeading({ children, lead }: { children: ReactNode; lead?: ReactNode }) {
  return (
    <header className="mb-6">
      <h1 id="page-title" className="text-2xl font-bold tracking-tight text-ink sm:text-3xl">
        {children}
      </h1>
      {lead ? <p className="mt-2 max-w-prose text-ink-muted">{lead}</p> : null}
    </header>
  );
}
