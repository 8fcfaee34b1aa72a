import type { ReactNode } from 'react';

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <section className="rounded-lg border border-dashed border-ink-300 bg-white px-6 py-10 text-center">
      <svg aria-hidden="true" viewBox="0 0 48 48" className="mx-auto mb-3 size-12 text-ink-300">
        <path d="M8 34a16 16 0 0 1 32 0" fill="none" stroke="currentColor" strokeWidth="4" strokeLinecap="round" />
        <path d="M24 34 15 24" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      </svg>
      <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
      {children ? <div className="mx-auto mt-2 max-w-prose text-base text-muted">{children}</div> : null}
      {action ? <div className="mt-5">{action}</div> : null}
    </section>
  );
}
