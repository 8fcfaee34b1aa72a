import type { CustomerProposalView } from '@contract';
import { money } from './format';

/**
 * What comes after the customer's choice. The signing steps (sign14: `../signing/SigningSteps`) and then the
 * deposit and the right to cancel (after14: `../after-signing/DepositStep`, `CancelPanel`) are mounted here,
 * at the places marked below, by the slices that build them.
 */
export function AfterChoice({ view }: { view: CustomerProposalView }) {
  const option = view.options.find((o) => o.position === view.chosen?.position);
  if (!option) return null;
  return (
    <section
      aria-labelledby="next-heading"
      className="rounded-lg border-2 border-ok bg-white p-4 shadow-card sm:p-6"
      id="next-steps"
    >
      <h2 id="next-heading" className="text-xl font-semibold text-ink-900">
        You chose {option.name}: {money(option.price.totalCents)}
      </h2>
      <p className="mt-1 text-base text-ink-950">
        You can still change your mind above until you sign. Next, {view.company.name} asks you to sign the proposal
        {option.price.depositCents > 0 ? ` and pay the ${money(option.price.depositCents)} deposit` : ''}.
      </p>
      {/* ── SIGNING SLOT (sign14): <SigningSteps proposalId={view.proposalId} view={view} /> renders here. ── */}
      {/* ── AFTER-SIGNING SLOT (after14): <DepositStep …/> and <CancelPanel …/> render here once signed. ── */}
    </section>
  );
}
