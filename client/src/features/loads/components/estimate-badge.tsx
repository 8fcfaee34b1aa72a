/** Says plainly that these are estimates, and which method made them. */
export function EstimateBadge() {
  return (
    <span className="inline-flex items-center rounded-full border border-amber-line bg-amber-soft px-3 py-0.5 text-sm font-semibold text-amber-deep">
      Estimate
    </span>
  );
}
