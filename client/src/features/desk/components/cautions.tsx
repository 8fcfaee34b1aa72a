/** The usual cautions beside refrigerant, pressure and electrical numbers (DESIGN.md, Safety), as calc words them. */
export function Cautions({ title, items }: { title: string; items: readonly string[] }) {
  if (items.length === 0) return null;
  return (
    <aside aria-label={title} className="rounded-md border border-amber-line bg-amber-soft p-3 text-sm text-ink-900">
      <p className="font-semibold">{title}</p>
      <ul className="mt-1 list-disc pl-5">
        {[...new Set(items)].map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </aside>
  );
}
