import type { CustomerProposalView } from '@contract';
import { CancelPanel, DepositStep } from '../after-signing';
import { SigningSteps } from '../signing';
import { money } from './format';

/**
 * What comes after the customer's choice. The signing steps (`../signing`: consent, signature, the signed
 * copy; they read `GET …/signing` themselves) and then the deposit and the right to cancel (`../after-signing`: `DepositStep`, `CancelPanel`, which read the signing,
 * the deposit and any cancellation from `GET …/after-signing` themselves).
 */
export function AfterChoice({ view, signed }: { view: CustomerProposalView; signed: boolean }) {
  const option = view.options.find((o) => o.position === view.chosen?.position);
  if (!option) return null;
  return (
    <section
      aria-labelledby="next-heading"
      className="rounded-lg border-2 border-ok bg-white p-4 shadow-card sm:p-6"
      id="next-steps"
    >
      <h2 id="next-heading" className="text-xl font-semibold text-ink-900">
        {signed ? 'You signed for' : 'You chose'} {option.name}: {money(option.price.totalCents)}
      </h2>
      {/* Once signed the choice is settled (the server refuses another), so the page no longer says it can change. */}
      {signed ? null : (
        <p className="mt-1 text-base text-ink-950">
          You can still change your mind above until you sign. Next, {view.company.name} asks you to sign the proposal
          {option.price.depositCents > 0 ? ` and pay the ${money(option.price.depositCents)} deposit` : ''}.
        </p>
      )}
      <SigningSteps proposalId={view.proposalId} chosenPosition={view.chosen?.position ?? null} />
      {/* After the signature: the deposit, then the right to cancel (each renders nothing before signing). */}
      <div className="mt-4 grid gap-4 empty:hidden">
        <DepositStep proposalId={view.proposalId} />
        <CancelPanel proposalId={view.proposalId} />
      </div>
    </section>
  );
}
