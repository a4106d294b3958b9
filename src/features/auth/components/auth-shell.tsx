import type { ReactNode } from 'react';

/** The frame of the screens used without a session: sign-in, password reset, invitation. */
export function AuthShell({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="min-h-dvh bg-paper px-4 py-10 sm:py-16">
      <main id="main" className="mx-auto w-full max-w-md">
        <p className="brand text-2xl">Broodcast</p>
        <p className="mt-1 text-sm text-ink-muted">Seasonal mosquito and transmission estimates for district health services</p>
        <section aria-labelledby="page-title" className="card mt-6">
          <h1 id="page-title" className="text-xl font-bold text-ink">
            {title}
          </h1>
          <div className="mt-4">{children}</div>
        </section>
      </main>
    </div>
  );
}
