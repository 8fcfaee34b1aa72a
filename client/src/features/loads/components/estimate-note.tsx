import { METHOD_ASSUMPTIONS, METHOD_NOTES, methodAssumptionText } from '@calc';
import { useId } from 'react';

export { EstimateBadge } from './estimate-badge';

export function MethodNote({ open = false }: { open?: boolean }) {
  const assumptionsId = useId();
  return (
    <details open={open} className="rounded-md border border-line bg-paper p-3 text-sm">
      <summary className="min-h-touch cursor-pointer font-semibold text-ink-900">
        How these numbers are worked out
      </summary>
      <p className="mt-2 text-ink-950">A load estimate is an estimate. Gaugeline’s method and assumptions:</p>
      <ul className="mt-1 list-disc pl-5 text-ink-950">
        {METHOD_NOTES.map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
      <h3 id={assumptionsId} className="mt-3 font-semibold text-ink-900">
        Assumptions the method makes
      </h3>
      <p className="mt-1 text-ink-950">
        Figures with no published source, and inputs the walk-through does not record. Each shows how far it moves the
        cooling load of an example ranch: 1,800 ft², slab on grade, 95 °F outdoors at 36° N.
      </p>
      <ul aria-labelledby={assumptionsId} className="mt-1 list-disc pl-5 text-ink-950">
        {METHOD_ASSUMPTIONS.map((a) => (
          <li key={a.key}>{methodAssumptionText(a)}</li>
        ))}
      </ul>
    </details>
  );
}
