/**
 * The desk's "ready to propose" mark on a job in the list: a tick and the words, on a soft green pill,
 * so it reads without colour. Nothing when the job is not marked.
 */
export function ReadyBadge({ at }: { at: string | null | undefined }) {
  if (!at) return null;
  return (
    <span className="inline-flex w-fit items-center gap-1 whitespace-nowrap rounded-full border border-ok bg-ok-soft px-2 py-0.5 text-sm font-semibold text-ok">
      <span aria-hidden="true">✓</span>
      Ready to propose
    </span>
  );
}
