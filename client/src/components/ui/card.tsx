import type { ReactNode } from 'react';

export function Card({ title, children, className = '' }: { title?: string; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg border border-line bg-white p-4 shadow-card sm:p-6 ${className}`}>
      {title ? <h2 className="mb-3 text-lg font-semibold text-ink-900">{title}</h2> : null}
      {children}
    </section>
  );
}
