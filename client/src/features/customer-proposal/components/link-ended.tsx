import { LINK_ENDED, type LinkEndedReason } from '@contract';
import type { ReactNode } from 'react';

export interface Contact {
  name: string;
  phone: string | null;
  email: string | null;
}

const REASONS: readonly string[] = ['expired', 'revoked', 'superseded'];
const isReason = (v: unknown): v is LinkEndedReason => typeof v === 'string' && REASONS.includes(v);

/** Reads a 410 problem's `reason` and `contact` members (sent only for a link that was real). */
export function endedFrom(extra: Readonly<Record<string, unknown>>): {
  reason: LinkEndedReason | null;
  contact: Contact | null;
} {
  const c = extra.contact;
  const contact =
    typeof c === 'object' && c !== null && typeof Reflect.get(c, 'name') === 'string'
      ? {
          name: String(Reflect.get(c, 'name')),
          phone: typeof Reflect.get(c, 'phone') === 'string' ? String(Reflect.get(c, 'phone')) : null,
          email: typeof Reflect.get(c, 'email') === 'string' ? String(Reflect.get(c, 'email')) : null,
        }
      : null;
  return { reason: isReason(extra.reason) ? extra.reason : null, contact };
}

/** The customer's page when the link (or the time it gave) is over: the server's "no longer works" words. */
export function LinkEnded({ detail, contact }: { detail: string; contact: Contact | null }) {
  let reach: ReactNode = null;
  if (contact) {
    const phone = contact.phone ? (
      <a className="font-semibold text-ink-800 underline" href={`tel:${contact.phone.replace(/[^0-9+]/g, '')}`}>
        {contact.phone}
      </a>
    ) : null;
    const email = contact.email ? (
      <a className="font-semibold text-ink-800 underline" href={`mailto:${contact.email}`}>
        {contact.email}
      </a>
    ) : null;
    reach = (
      <p className="mt-3 text-lg">
        {LINK_ENDED.contact} <strong>{contact.name}</strong>
        {phone ? <> at {phone}</> : null}
        {email ? (
          <>
            {phone ? ' or ' : ' at '}
            {email}
          </>
        ) : null}
        .
      </p>
    );
  }
  return (
    <main className="min-h-dvh bg-paper px-4 py-10">
      <div role="alert" className="mx-auto max-w-lg rounded-lg bg-white p-6 shadow-card">
        <h1 className="text-2xl font-semibold text-ink-900">{LINK_ENDED.title}</h1>
        <p className="mt-3 text-lg text-ink-950">{detail}</p>
        {reach}
      </div>
    </main>
  );
}
