import { useId, useState } from 'react';
import type { SigningState } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { errorMessage } from '../../../lib/api-error';
import { proposalPdfHref, useGiveConsent } from './api';
import { ReloadHint } from './reload-hint';

/**
 * Step 1: the consumer disclosure ESIGN requires before consent (15 U.S.C. §7001(c)(1)), shown in full —
 * not behind a link — with an explicit box to tick and its own button. The text comes from the server,
 * which keeps its hash with the consent.
 */
export function ConsentStep({ proposalId, state }: { proposalId: string; state: SigningState }) {
  const [agreed, setAgreed] = useState(false);
  const give = useGiveConsent(proposalId);
  const boxId = useId();
  return (
    <div className="flex flex-col gap-4">
      <p className="text-base text-ink-950">
        Before you sign on this screen, please read how signing electronically works. You can also sign on paper: see
        &ldquo;Changing your mind&rdquo; below.
      </p>
      <div className="flex flex-col gap-3 rounded-md border border-line bg-paper p-4">
        {state.consent.paragraphs.map((p) => (
          <div key={p.heading}>
            <h4 className="text-base font-semibold text-ink-900">{p.heading}</h4>
            <p className="text-base text-ink-950">{p.text}</p>
          </div>
        ))}
        <p className="text-sm text-muted">
          This notice is required by the U.S. E-SIGN Act, 15 U.S.C. §7001(c). Notice {state.consent.disclosureVersion}.
        </p>
      </div>
      <a
        className="min-h-touch self-start py-2 text-base font-semibold text-ink-800 underline"
        href={proposalPdfHref(proposalId)}
        target="_blank"
        rel="noopener"
      >
        Open the proposal&rsquo;s PDF to check it opens on this device
      </a>
      <label
        htmlFor={boxId}
        className="flex min-h-touch cursor-pointer items-start gap-3 rounded-md border-2 border-ink-200 bg-white p-3"
      >
        <input
          id={boxId}
          type="checkbox"
          className="mt-0.5 h-7 w-7 shrink-0 accent-ink-800"
          checked={agreed}
          onChange={(e) => setAgreed(e.target.checked)}
        />
        <span className="text-base text-ink-950">
          I have read this notice, I can open the proposal&rsquo;s PDF on this device, and I agree to sign
          electronically.
        </span>
      </label>
      {give.isError ? (
        <Alert tone="danger" title="Your agreement was not saved">
          {errorMessage(give.error)}
          <ReloadHint error={give.error} />
        </Alert>
      ) : null}
      <Button
        className="w-full sm:w-auto sm:self-start"
        disabled={!agreed}
        busy={give.isPending}
        onClick={() => give.mutate({ versionNumber: state.version.number, disclosureSha256: state.consent.sha256 })}
      >
        I agree — continue to sign
      </Button>
    </div>
  );
}
