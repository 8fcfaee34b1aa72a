/** Gaugeline's mark: a half dial with a needle swinging toward the amber mark. Our own drawing. */
export function GaugeMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 32 32" className={className}>
      <path d="M5 22a11 11 0 0 1 22 0" fill="none" stroke="currentColor" strokeWidth="3.5" strokeLinecap="round" />
      <path d="M24.5 12.5 26.6 11" stroke="var(--color-amber)" strokeWidth="3" strokeLinecap="round" />
      <path d="M16 22 22 11" stroke="var(--color-amber)" strokeWidth="3" strokeLinecap="round" />
      <circle cx="16" cy="22" r="3" fill="currentColor" />
    </svg>
  );
}

export function Wordmark({ inverse = false }: { inverse?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-2 ${inverse ? 'text-white' : 'text-ink-900'}`}>
      <GaugeMark />
      <span className="text-xl font-semibold tracking-tight">Gaugeline</span>
    </span>
  );
}
