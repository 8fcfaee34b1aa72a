import type { ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useSigningState } from './api';
import { ConsentStep } from './consent-step';
import { SignedStep } from './signed-step';
import { SignStep } from './sign-step';

type Step = 'consent' | 'sign' | 'signed';
const STEPS: { key: Step; label: string }[] = [
  { key: 'consent', label: 'Agree to sign electronically' },
  { key: 'sign', label: 'Sign' },
  { key: 'signed', label: 'Signed' },
];

function StepFrame({ n, current, children }: { n: number; current: Step; children: ReactNode }) {
  const step = STEPS[n]!;
  const at = STEPS.findIndex((s) => s.key === current);
  const done = n < at;
  const active = n === at;
  return (
    <li className={`rounded-lg border p-3 sm:p-4 ${active ? 'border-ink-700 bg-white' : 'border-line bg-paper'}`}>
      <h3
        className={`flex items-center gap-3 text-lg font-semibold ${active ? 'text-ink-900' : 'text-muted'}`}
        aria-current={active ? 'step' : undefined}
      >
        <span
          aria-hidden="true"
          className={`flex h-8 w-8 shrink-0 items-center justify-center rounded-full text-base ${
            done ? 'bg-ok text-white' : active ? 'bg-ink-800 text-white' : 'bg-ink-100 text-ink-700'
          }`}
        >
          {done ? '✓' : n + 1}
        </span>
        {step.label}
        {done ? <span className="sr-only">(done)</span> : null}
      </h3>
      {active ? <div className="mt-3">{children}</div> : null}
    </li>
  );
}

/**
 * Signing the proposal on the customer's page, after the option choice: (1) the consent to sign
 * electronically with its full text and an explicit tick, (2) the signature, drawn or typed, beside the
 * statement signed, (3) signed, with the sealed copy to download when ready. `chosenPosition` is the
 * option chosen on the page; a new choice reloads the statement to sign.
 */
export function SigningSteps({ proposalId, chosenPosition }: { proposalId: string; chosenPosition: number | null }) {
  const query = useSigningState(proposalId, chosenPosition);
  if (query.isPending) return <Spinner label="Loading the signing steps…" />;
  if (query.isError || !query.data)
    return (
      <div className="mt-4">
        <Alert tone="danger" title="The signing steps could not be loaded">
          {errorMessage(query.error)}
        </Alert>
      </div>
    );
  const state = query.data;
  const current: Step = state.signature ? 'signed' : state.consent.givenAt ? 'sign' : 'consent';
  return (
    <section aria-labelledby="signing-heading" className="mt-4">
      <h2 id="signing-heading" className="sr-only">
        Sign the proposal
      </h2>
      {!state.version.pdfReady && !state.signature ? (
        <Alert tone="info">The proposal&rsquo;s document is still being prepared. You can sign in a minute.</Alert>
      ) : null}
      <ol className="flex flex-col gap-3">
        <StepFrame n={0} current={current}>
          <ConsentStep proposalId={proposalId} state={state} />
        </StepFrame>
        <StepFrame n={1} current={current}>
          <SignStep proposalId={proposalId} state={state} />
        </StepFrame>
        <StepFrame n={2} current={current}>
          <SignedStep proposalId={proposalId} state={state} />
        </StepFrame>
      </ol>
    </section>
  );
}
