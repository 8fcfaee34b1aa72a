import { useRef, useState } from 'react';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-error';
import { proposalDetailsQueryOptions, useRemoveLogo, useUploadLogo } from '../api/proposal-details';

const why = (e: unknown): string =>
  isApiError(e) ? e.detail : 'The logo could not be sent. Check the connection and try again.';

/**
 * The company's logo for the proposal's cover. The server checks the file by its content (JPEG, PNG or
 * WebP), its size, and re-encodes it; what it refuses is said here in its words.
 */
export function LogoField() {
  const { logo } = useSuspenseQuery(proposalDetailsQueryOptions()).data;
  const upload = useUploadLogo();
  const remove = useRemoveLogo();
  const input = useRef<HTMLInputElement>(null);
  const [message, setMessage] = useState<{ tone: 'ok' | 'danger'; text: string } | null>(null);

  const send = async (file: File | undefined) => {
    if (!file) return;
    setMessage(null);
    try {
      await upload.mutateAsync(file);
      setMessage({ tone: 'ok', text: 'Logo saved. Proposals issued from now on show it on the cover.' });
    } catch (e) {
      setMessage({ tone: 'danger', text: why(e) });
    } finally {
      if (input.current) input.current.value = '';
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-4 sm:flex-row sm:items-center">
        <div className="flex h-28 w-full max-w-xs items-center justify-center rounded-md border border-dashed border-line bg-white p-3">
          {logo ? (
            <img
              src={logo.url}
              alt="The company’s logo as proposals print it"
              width={logo.width}
              height={logo.height}
              className="max-h-full max-w-full object-contain"
            />
          ) : (
            <p className="text-sm text-muted">No logo yet: the cover prints the company’s name.</p>
          )}
        </div>
        {logo ? (
          <p className="text-sm text-muted">
            {`${logo.width} × ${logo.height} px, kept as PNG. Replacing it changes only proposals issued afterwards.`}
          </p>
        ) : null}
      </div>
      <div className="flex flex-col gap-3 sm:flex-row">
        <label className="sr-only" htmlFor="company-logo-file">
          Logo file
        </label>
        <input
          ref={input}
          id="company-logo-file"
          type="file"
          accept="image/png,image/jpeg,image/webp"
          className="sr-only"
          onChange={(e) => void send(e.target.files?.[0])}
        />
        <Button
          variant="secondary"
          busy={upload.isPending}
          onClick={() => input.current?.click()}
          aria-describedby="company-logo-hint"
        >
          {logo ? 'Replace logo' : 'Upload logo'}
        </Button>
        {logo ? (
          <Button
            variant="ghost"
            busy={remove.isPending}
            onClick={async () => {
              setMessage(null);
              try {
                await remove.mutateAsync();
                setMessage({ tone: 'ok', text: 'Logo removed from proposals issued from now on.' });
              } catch (e) {
                setMessage({ tone: 'danger', text: why(e) });
              }
            }}
          >
            Remove logo
          </Button>
        ) : null}
      </div>
      <p id="company-logo-hint" className="text-sm text-muted">
        A JPEG, PNG or WebP image; a transparent background stays transparent. Wide logos print best.
      </p>
      {message ? <Alert tone={message.tone}>{message.text}</Alert> : null}
    </div>
  );
}
