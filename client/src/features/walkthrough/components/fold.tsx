import { useState, type ReactNode } from 'react';

interface FoldProps {
  /** The one line shown folded (and above the fields when open). */
  summary: ReactNode;
  /** Everything needed is filled in: it may start folded. */
  complete: boolean;
  /** A field inside shows an error: it stays open. */
  hasError: boolean;
  /** Added during this visit: opens to be filled in. */
  startOpen?: boolean;
  className?: string;
  summaryClassName?: string;
  children: ReactNode;
}

/**
 * A part of the room form that folds to one line once complete (walls, windows, above/below, people), so a
 * phone scrolls past what is done. It starts open when incomplete, just added or wrong, and never folds
 * while a field inside shows an error; a tap on the line opens or closes it.
 *
 * A fold that starts closed renders its fields when first opened, and keeps them after: on a phone the folded
 * walls, windows and sections were a third of the walk-through's first render, all hidden (issue 11). Drawn
 * hidden after the first idle moment instead, they still cost a phone 60–145 ms of layout just as the room
 * name took its first letter: the browser lays out a closed <details>' contents whenever something asks
 * about its fields (its form autofill scan after each change to the page, a focus, a tap's hit test).
 */
export function Fold({
  summary,
  complete,
  hasError,
  startOpen = false,
  className = '',
  summaryClassName = '',
  children,
}: FoldProps) {
  const [open, setOpen] = useState(() => startOpen || hasError || !complete);
  // Opened once: the fields stay (closing it again only hides them, as before).
  const [opened, setOpened] = useState(open);
  if ((open || hasError) && !opened) setOpened(true);
  return (
    <details
      open={open || hasError}
      onToggle={(e) => {
        const details = e.currentTarget;
        // React would not write `open` again (its prop did not change), so a fold with an error reopens here.
        if (!details.open && hasError) details.open = true;
        else setOpen(details.open);
      }}
      className={`group ${className}`}
    >
      <summary className={`flex min-h-touch cursor-pointer list-none items-center gap-2 ${summaryClassName}`}>
        {/* The flex summary has no marker of its own: a chevron drawn in CSS (no text) turns as it opens. */}
        <span
          aria-hidden="true"
          className="ml-1 size-2 shrink-0 -rotate-45 border-r-2 border-b-2 border-ink-700 transition-transform group-open:rotate-45"
        />
        {summary}
      </summary>
      {open || hasError || opened ? children : null}
    </details>
  );
}

/** The label an option list gives a value, or the value itself. */
export function optionLabel(options: readonly { value: string; label: string }[], value: string): string {
  return options.find((o) => o.value === value)?.label ?? value;
}
