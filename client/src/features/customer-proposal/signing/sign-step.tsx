import { useId, useState } from 'react';
import type { SigningState } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { inputClass } from '../../../components/ui/field-shell';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { useSign } from './api';
import { ReloadHint } from './reload-hint';
import { SignaturePadField } from './signature-pad-field';

type Method = 'drawn' | 'typed';

function TextField({
  label,
  value,
  onChange,
  type = 'text',
  autoComplete,
  error,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  type?: string;
  autoComplete: string;
  error?: string | undefined;
}) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-900">
        {label}
      </label>
      <input
        id={id}
        type={type}
        className={inputClass}
        value={value}
        autoComplete={autoComplete}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => onChange(e.target.value)}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/**
 * Step 2: who signs (name and e-mail, filled from the proposal), the signature — drawn in a box or a
 * name typed — beside the statement being signed, and the button that signs.
 */
export function SignStep({ proposalId, state }: { proposalId: string; state: SigningState }) {
  const sign = useSign(proposalId);
  const [method, setMethod] = useState<Method>('drawn');
  const [name, setName] = useState(state.signerDefaults.name);
  const [email, setEmail] = useState(state.signerDefaults.email);
  const [typedName, setTypedName] = useState('');
  const [image, setImage] = useState<string | null>(null);
  const [missing, setMissing] = useState<string | null>(null);
  const padId = useId();
  const typedId = useId();
  const statement = state.statement;
  const option = state.option;
  if (!statement || !option) return null;
  const fieldError = (path: string) =>
    isApiError(sign.error) ? sign.error.errors.find((e) => e.path === path)?.message : undefined;

  const submit = () => {
    if (!name.trim() || !email.trim()) return setMissing('Enter your name and e-mail address.');
    if (method === 'drawn' && !image) return setMissing('Draw your signature in the box.');
    if (method === 'typed' && !typedName.trim()) return setMissing('Type your name as your signature.');
    setMissing(null);
    const common = {
      versionNumber: state.version.number,
      optionPosition: option.position,
      statementSha256: statement.sha256,
      signerName: name.trim(),
      signerEmail: email.trim(),
    };
    sign.mutate(
      method === 'drawn'
        ? { method: 'drawn', ...common, image: image ?? '' }
        : { method: 'typed', ...common, typedName: typedName.trim() },
    );
  };

  const tab = (m: Method, label: string) => (
    <button
      type="button"
      role="tab"
      aria-selected={method === m}
      onClick={() => setMethod(m)}
      className={`min-h-touch flex-1 rounded-md px-3 text-base font-semibold ${
        method === m ? 'bg-ink-800 text-white' : 'bg-white text-ink-800 border border-line'
      }`}
    >
      {label}
    </button>
  );

  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <TextField
          label="Your full name"
          value={name}
          onChange={setName}
          autoComplete="name"
          error={fieldError('signerName')}
        />
        <TextField
          label="Your e-mail (the signed copy goes here)"
          value={email}
          onChange={setEmail}
          type="email"
          autoComplete="email"
          error={fieldError('signerEmail')}
        />
      </div>
      <div role="tablist" aria-label="How to sign" className="flex gap-2">
        {tab('drawn', 'Draw my signature')}
        {tab('typed', 'Type my name')}
      </div>
      {method === 'drawn' ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={padId} className="text-sm font-semibold text-ink-900">
            Sign with your finger or mouse
          </label>
          <SignaturePadField id={padId} onChange={setImage} />
          {fieldError('image') ? <p className="text-sm font-semibold text-danger">{fieldError('image')}</p> : null}
        </div>
      ) : (
        <div className="flex flex-col gap-1">
          <label htmlFor={typedId} className="text-sm font-semibold text-ink-900">
            Type your name as your signature
          </label>
          <input
            id={typedId}
            className={`${inputClass} font-serif text-2xl italic`}
            value={typedName}
            autoComplete="name"
            onChange={(e) => setTypedName(e.target.value)}
          />
          {fieldError('typedName') ? (
            <p className="text-sm font-semibold text-danger">{fieldError('typedName')}</p>
          ) : null}
        </div>
      )}
      <div className="rounded-md border-l-4 border-ink-700 bg-ink-50 p-3">
        <p className="text-sm font-semibold text-ink-900">What you are signing</p>
        <p className="text-base text-ink-950">{statement.text}</p>
      </div>
      {missing ? <Alert tone="warning">{missing}</Alert> : null}
      {sign.isError ? (
        <Alert tone="danger" title="Not signed">
          {errorMessage(sign.error)}
          <ReloadHint error={sign.error} />
        </Alert>
      ) : null}
      <Button className="w-full sm:w-auto sm:self-start" busy={sign.isPending} onClick={submit}>
        Sign and accept the proposal
      </Button>
    </div>
  );
}
