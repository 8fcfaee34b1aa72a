import { METHOD_NOTES } from '@calc';

export { EstimateBadge } from './estimate-badge';

export function MethodNote({ open = false }: { open?: boolean }) {
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
    </details>
  );
}
