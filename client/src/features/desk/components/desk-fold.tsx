import { useState, type ReactNode } from 'react';
import { usePhone } from '../../../lib/use-phone';

/**
 * A part of the desk that folds to one line on a phone (the salesperson wants the price and the verdicts, not
 * every figure) and starts open on a wider screen, where the estimator wants everything. A native
 * details/summary: a button to assistive technology with its expanded state, reachable by keyboard, a
 * 44 px line to tap. Whether it starts open is read once; after that it is the person's choice.
 */
export function DeskFold({
  summary,
  children,
  startOpen,
  keepMounted = false,
  className = '',
}: {
  /** The one line shown folded: what is inside, with its verdict or total. Text only (no controls). */
  summary: ReactNode;
  children: ReactNode;
  /** Overrides the width rule (e.g. open while something inside needs attention). */
  startOpen?: boolean;
  /**
   * A form inside keeps what was typed while folded (it is hidden, not dropped). Otherwise the content is drawn
   * only once opened, so a slow phone does not lay out figures nobody asked for.
   */
  keepMounted?: boolean;
  className?: string;
}) {
  const phone = usePhone();
  const [open, setOpen] = useState(() => startOpen ?? !phone);
  return (
    <details
      open={open}
      onToggle={(e) => setOpen(e.currentTarget.open)}
      className={`[&[open]>summary>span:first-child]:rotate-45 ${className}`}
    >
      <summary className="flex min-h-touch cursor-pointer list-none items-center gap-2 rounded-md py-1 text-sm">
        {/* The flex summary has no marker of its own: a chevron drawn in CSS turns as its own fold opens (not
            with an outer one: folds nest, so the rule names the summary's own details). */}
        <span
          aria-hidden="true"
          className="mx-1 size-2 shrink-0 -rotate-45 border-r-2 border-b-2 border-ink-700 transition-transform"
        />
        {summary}
      </summary>
      {open || keepMounted ? children : null}
    </details>
  );
}
