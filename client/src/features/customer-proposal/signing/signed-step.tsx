import type { SigningState } from '@contract';
import { buttonClass } from '../../../components/ui/button';
import { signedPdfHref } from './api';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeStyle: 'short' });

/** Step 3: signed — who and when, and the sealed copy to download once the server has made it. */
export function SignedStep({ proposalId, state }: { proposalId: string; state: SigningState }) {
  const s = state.signature;
  if (!s) return null;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-base text-ink-950">
        Signed by <span className="font-semibold">{s.signerName}</span> on {when.format(new Date(s.signedAt))}. Thank
        you.
      </p>
      {state.signedPdf === 'ready' ? (
        <>
          <a
            className={buttonClass('primary', 'w-full sm:w-auto sm:self-start')}
            href={signedPdfHref(proposalId)}
            download
          >
            Download your signed copy (PDF)
          </a>
          <p className="text-sm text-muted">
            A copy has also been e-mailed to you. The file is sealed with a digital signature: a PDF reader shows if it
            is ever changed.
          </p>
        </>
      ) : (
        <p role="status" className="text-base text-muted">
          Your signed copy is being prepared. It will be ready to download here in a moment, and it is also sent to you
          by e-mail.
        </p>
      )}
    </div>
  );
}
