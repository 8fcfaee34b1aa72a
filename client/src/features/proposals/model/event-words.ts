import { formatMoney } from '@calc';
import type { ProposalEventKind, ProposalEventRecord } from '@contract';

/**
 * The audit trail in words (issue 14). Every kind the contract names has its sentence here — the ones other
 * slices write (sending, the customer's visits, signing, paying, cancelling) too — so the office reads the trail
 * in order without codes. An event's `data` is free-form JSON written by the server: only strings and
 * numbers of the expected keys are read, and React prints them as text.
 */

const str = (data: Record<string, unknown>, key: string): string | null => {
  const v = data[key];
  return typeof v === 'string' && v.trim() !== '' ? v : null;
};
const num = (data: Record<string, unknown>, key: string): number | null => {
  const v = data[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
};

const of = (n: number | null) => (n === null ? 'the proposal' : `version ${n}`);
const Of = (n: number | null) => (n === null ? 'The proposal' : `Version ${n}`);

/** One line of the trail: what happened, and an optional detail line. */
export interface EventWords {
  readonly title: string;
  readonly detail: string | null;
}

type Describe = (e: ProposalEventRecord) => EventWords;

const words = (title: string, detail: string | null = null): EventWords => ({ title, detail });

const DESCRIBE: Record<ProposalEventKind, Describe> = {
  issued: (e) => words(`${Of(e.versionNumber)} issued`),
  superseded: (e) => {
    const by = num(e.data, 'by');
    return words(`${Of(e.versionNumber)} superseded${by === null ? '' : ` by version ${by}`}`);
  },
  sent: (e) => {
    const to = str(e.data, 'to') ?? str(e.data, 'email');
    return words(`${Of(e.versionNumber)} sent to the customer${to ? ` at ${to}` : ''}`);
  },
  'send-failed': (e) =>
    words(
      `The e-mail with ${of(e.versionNumber)} could not be sent`,
      str(e.data, 'reason') ?? 'It is tried again by itself; the screen says “waiting to send” meanwhile.',
    ),
  opened: (e) => words(`The customer opened the link to ${of(e.versionNumber)}`),
  viewed: (e) => words(`The customer read ${of(e.versionNumber)} on their page`),
  downloaded: (e) => words(`The customer downloaded the PDF of ${of(e.versionNumber)}`),
  'option-chosen': (e) => {
    const name = str(e.data, 'name') ?? str(e.data, 'optionName');
    const position = num(e.data, 'position');
    const which = name ? `“${name}”` : position !== null ? `option ${position}` : 'an option';
    return words(`The customer chose ${which}`);
  },
  consented: () => words('The customer agreed to sign electronically'),
  signed: (e) => {
    const signer = str(e.data, 'signerName') ?? str(e.data, 'signer') ?? str(e.data, 'name');
    return words(`${Of(e.versionNumber)} signed${signer ? ` by ${signer}` : ' by the customer'}`);
  },
  paid: (e) => {
    const cents = num(e.data, 'amountCents');
    return words(`Deposit paid${cents === null ? '' : `: ${formatMoney(cents)}`}`);
  },
  refunded: (e) => {
    const cents = num(e.data, 'amountCents');
    return words(`Deposit refunded${cents === null ? '' : `: ${formatMoney(cents)}`}`);
  },
  cancelled: (e) =>
    words('The buyer cancelled within the three-business-day cancellation period', str(e.data, 'reason') ?? null),
  'link-revoked': (e) => words(`The link to ${of(e.versionNumber)} was turned off`, str(e.data, 'reason')),
  'marked-lost': (e) => {
    const reason = str(e.data, 'reason');
    return words(`Job marked lost${reason ? `: ${reason}` : ''}`);
  },
  'pdf-ready': (e) => {
    const sha = str(e.data, 'sha256');
    return words(`PDF of ${of(e.versionNumber)} made`, sha ? `SHA-256 ${sha}` : null);
  },
  'pdf-failed': (e) => {
    const tries = num(e.data, 'attempts');
    const reason = str(e.data, 'reason');
    return words(
      `PDF of ${of(e.versionNumber)} could not be made${tries === null ? '' : ` after ${tries} tries`}`,
      reason ? `Why: ${reason}` : null,
    );
  },
};

export function describeEvent(e: ProposalEventRecord): EventWords {
  return DESCRIBE[e.kind](e);
}

/** Who did it, in words. */
export function eventActor(e: ProposalEventRecord): string {
  switch (e.by.kind) {
    case 'staff':
      return e.by.name;
    case 'customer':
      return 'The customer';
    case 'system':
      return 'Automatic';
  }
}

/** The latest reason a version's PDF failed (the trail's last `pdf-failed` for it), or null. */
export function pdfFailure(events: readonly ProposalEventRecord[], versionNumber: number): string | null {
  const last = [...events].reverse().find((e) => e.kind === 'pdf-failed' && e.versionNumber === versionNumber);
  return last ? (str(last.data, 'reason') ?? 'No reason was recorded.') : null;
}
