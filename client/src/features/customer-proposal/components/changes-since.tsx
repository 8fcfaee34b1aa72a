import type { CustomerProposalView } from '@contract';
import { usDate } from './format';

/** "Changed since the version of March 3, 2026: …" — what is different from the version sent before this one. */
export function ChangesSince({ changes }: { changes: NonNullable<CustomerProposalView['changes']> }) {
  return (
    <section aria-labelledby="changes-heading" className="rounded-lg border-l-4 border-amber-line bg-amber-soft p-4">
      <h2 id="changes-heading" className="text-lg font-semibold text-ink-950">
        Changed since the version of {usDate(changes.sinceIssuedAt)}
      </h2>
      {changes.sentences.length ? (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-base text-ink-950">
          {changes.sentences.map((s, i) => (
            <li key={`${i}-${s}`}>{s}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-2 text-base text-ink-950">Nothing you are shown has changed; this version replaces it.</p>
      )}
    </section>
  );
}
