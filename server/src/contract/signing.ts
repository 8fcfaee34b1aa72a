import { z } from 'zod';

/**
 * Signing a proposal electronically (issue 14): the customer's consent to do business electronically,
 * the acceptance statement they sign, the signature they give, and what their page learns about it.
 */

/**
 * The consumer disclosure shown before a customer agrees to sign electronically, required by ESIGN,
 * 15 U.S.C. §7001(c)(1): before consenting, the consumer is told (B)(i) of the right to have the record
 * on paper and of the right to withdraw consent, with its conditions and consequences; (B)(ii) whether the
 * consent covers only this transaction; (B)(iii) how to withdraw consent and how to update contact
 * details; (B)(iv) how to get a paper copy and whether it costs anything; (C)(i) the hardware and
 * software needed to open and keep the records; and (C)(ii) consents in a way that shows they can open
 * records in the electronic form used. Our own plain words; counsel approves the final text (the
 * security plan §4 says so). Bump the version when a word changes: the version and the SHA-256 of the
 * exact text shown are stored with the `consented` event.
 */
export const ESIGN_DISCLOSURE_VERSION = 'esign-2026-12-1';

export interface DisclosureCompany {
  readonly name: string;
  readonly phone: string | null;
  readonly email: string | null;
  readonly address: string | null;
}

/** How to reach the company, in words ("call 555-0142, e-mail office@…, or write to …"). */
function contactWords(c: DisclosureCompany): string {
  const ways = [
    c.phone ? `call ${c.phone}` : null,
    c.email ? `e-mail ${c.email}` : null,
    c.address ? `write to ${c.address.replace(/\s*[\r\n]+\s*/g, ', ')}` : null,
  ].filter((w): w is string => w !== null);
  if (ways.length === 0) return `contact ${c.name} the way you usually reach them`;
  if (ways.length === 1) return ways[0]!;
  return `${ways.slice(0, -1).join(', ')} or ${ways[ways.length - 1]}`;
}

/** The disclosure's paragraphs, each a heading and its text, for one company. */
export function esignDisclosure(company: DisclosureCompany): { heading: string; text: string }[] {
  const name = company.name;
  const contact = contactWords(company);
  return [
    {
      heading: 'What you agree to',
      text: `You agree that ${name} may give you this proposal, its terms, the notice of your right to cancel and the signed copy electronically, and that you sign it electronically instead of on paper. Your electronic signature counts the same as one in ink.`,
    },
    {
      heading: 'What this covers',
      text: `This agreement covers only this proposal and the records that belong to it: the signed copy, the notice of your right to cancel, deposit receipts and any cancellation. It does not cover anything else.`,
    },
    {
      heading: 'Paper copies',
      text: `You have the right to have any of these records on paper. To ask for a paper copy, ${contact}. A paper copy is free.`,
    },
    {
      heading: 'Changing your mind',
      text: `You do not have to sign electronically, and you may withdraw this agreement at any time before you sign: ${contact} and ${name} will arrange to sign on paper instead. Withdrawing costs nothing. It does not undo anything you have already signed electronically; records you sign afterwards will be on paper.`,
    },
    {
      heading: 'Keeping your contact details up to date',
      text: `If your e-mail address changes, ${contact} so the signed copy and any notices reach you.`,
    },
    {
      heading: 'What you need',
      text: `A phone, tablet or computer with a current web browser (one updated in the last two years), an internet connection, an e-mail account, and a program that opens PDF files (most browsers and phones have one). To keep a copy, you need room to save a file or a printer.`,
    },
    {
      heading: 'Showing you can open the records',
      text: `The proposal is a PDF file. By ticking the box below you confirm that you can open and read the proposal's PDF on this device, and that you agree to sign electronically.`,
    },
  ];
}

/** The text whose SHA-256 is stored with the consent: headings and paragraphs, one per line. */
export function disclosureText(paragraphs: readonly { heading: string; text: string }[]): string {
  return paragraphs.map((p) => `${p.heading}\n${p.text}`).join('\n\n');
}

/** The largest drawn signature accepted: a PNG of at most this many bytes (decoded). */
export const SIGNATURE_IMAGE_MAX_BYTES = 150_000;
/** Its largest width and height in pixels (a phone's canvas at 3× is about 1100 × 600). */
export const SIGNATURE_IMAGE_MAX_PX = { width: 2400, height: 1200 } as const;

const sha256Hex = z.string().regex(/^[0-9a-f]{64}$/, 'Must be a SHA-256 in hex.');
const versionNumber = z.number().int('Must be a version number.').min(1).max(100_000);
const oneLine = (max: number, what: string) =>
  z
    .string()
    .trim()
    .min(1, `Enter ${what}.`)
    .max(max, `At most ${max} characters.`)
    // eslint-disable-next-line no-control-regex -- control characters (CR/LF) are exactly what this refuses
    .refine((s) => !/[\u0000-\u001f\u007f]/.test(s), 'Only one line of text.');

/** POST /api/proposals/:proposalId/consent: the version on screen and the hash of the disclosure shown. */
export const consentBody = z.strictObject({
  versionNumber,
  disclosureSha256: sha256Hex,
});
export type ConsentBody = z.infer<typeof consentBody>;

/** POST /api/proposals/:proposalId/signature. */
export const signatureBody = z.discriminatedUnion('method', [
  z.strictObject({
    method: z.literal('drawn'),
    versionNumber,
    optionPosition: z.number().int().min(1).max(3),
    /** The statement shown beside the button, by its SHA-256 (the server stores its own text). */
    statementSha256: sha256Hex,
    signerName: oneLine(120, 'your full name'),
    signerEmail: z.email('Enter a valid e-mail address.').max(254),
    /** `data:image/png;base64,…` from the drawing pad. */
    image: z.string().max(Math.ceil((SIGNATURE_IMAGE_MAX_BYTES * 4) / 3) + 40, 'The drawing is too large.'),
  }),
  z.strictObject({
    method: z.literal('typed'),
    versionNumber,
    optionPosition: z.number().int().min(1).max(3),
    statementSha256: sha256Hex,
    signerName: oneLine(120, 'your full name'),
    signerEmail: z.email('Enter a valid e-mail address.').max(254),
    /** The name typed as the signature. */
    typedName: oneLine(120, 'your name as your signature'),
  }),
]);
export type SignatureBody = z.infer<typeof signatureBody>;

export const SIGNATURE_METHODS = ['drawn', 'typed'] as const;

/** What the customer's page knows about signing the proposal's current version. */
export const signingState = z.object({
  version: z.object({ number: z.number().int(), pdfReady: z.boolean() }),
  /** The option the customer chose (the latest option-chosen event), or null before a choice. */
  option: z
    .object({
      position: z.number().int(),
      name: z.string(),
      totalCents: z.number().int(),
      depositCents: z.number().int(),
    })
    .nullable(),
  consent: z.object({
    disclosureVersion: z.string(),
    paragraphs: z.array(z.object({ heading: z.string(), text: z.string() })),
    sha256: sha256Hex,
    /** When the customer consented for this version (ISO time), or null. */
    givenAt: z.string().nullable(),
  }),
  /** The sentence beside the sign button, and its SHA-256 (null before an option is chosen). */
  statement: z.object({ text: z.string(), sha256: sha256Hex }).nullable(),
  /** Who the proposal is for, to fill the signer's fields. */
  signerDefaults: z.object({ name: z.string(), email: z.string() }),
  signature: z
    .object({
      signedAt: z.string(),
      signerName: z.string(),
      method: z.enum(SIGNATURE_METHODS),
      optionPosition: z.number().int(),
    })
    .nullable(),
  /** The sealed PDF: null before signing, 'waiting' while the queue makes it, 'ready' to download. */
  signedPdf: z.enum(['waiting', 'ready']).nullable(),
});
export type SigningState = z.infer<typeof signingState>;

/**
 * The acceptance statement beside the sign button (ESIGN §7006(5): a signature is made "with the intent
 * to sign"): it names the company, the version, the option, its total and its deposit.
 */
const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

export function acceptanceStatement(a: {
  company: string;
  versionNumber: number;
  optionPosition: number;
  optionName: string;
  totalCents: number;
  depositCents: number;
}): string {
  const deposit = a.depositCents === 0 ? 'no deposit' : `a deposit of ${usd.format(a.depositCents / 100)}`;
  return `I accept option ${a.optionPosition}, “${a.optionName}”, of proposal version ${a.versionNumber} from ${a.company}, for a total of ${usd.format(a.totalCents / 100)} with ${deposit}, and its terms and warranty. I sign it electronically.`;
}
