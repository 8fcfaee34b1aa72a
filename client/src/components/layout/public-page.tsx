import type { ReactNode } from 'react';
import { Wordmark } from './wordmark';

/** The pages used signed out (sign in, forgot and reset password): the mark over one white card. */
export function PublicPage({ title, lead, children }: { title: string; lead: ReactNode; children: ReactNode }) {
  return (
    <main className="flex min-h-dvh flex-col items-center bg-ink-900 px-4 py-10 sm:justify-center">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex justify-center">
          <Wordmark inverse />
        </div>
        <div className="rounded-lg bg-white p-6 shadow-card">
          <h1 className="mb-1 text-xl font-semibold text-ink-900">{title}</h1>
          <p className="mb-5 text-base text-muted">{lead}</p>
          {children}
        </div>
      </div>
    </main>
  );
}
