import { z } from 'zod';
import { emailRule } from './fields';

/**
 * What the company puts on every proposal (company settings, issue 14): contact lines for the cover and
 * the right-to-cancel notice, the licence text, terms, warranty, and the extra cancellation wording a
 * state's law may add (16 CFR 429.2 keeps stricter state rules in force). The owner edits them on
 * /settings; issuing a version copies them into its frozen snapshot. Texts are kept as typed (trimmed,
 * Windows line ends made '\n'); a control character other than a line break or a tab is refused, since it
 * would print as nothing or garbage in the PDF. '' means "not given".
 */

export const PROPOSAL_TEXT_MAX = 20000;
export const ADDRESS_MAX = 400;
export const ADDRESS_LINES_MAX = 4;
export const LICENCE_MAX = 300;

// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_EXCEPT_BREAKS = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_ANY = /[\u0000-\u001f\u007f-\u009f]/;

const normalised = (label: string) =>
  z.string({ message: `The ${label} must be text.` }).transform((s) => s.replace(/\r\n?/g, '\n').trim());

/** Several lines of text, at most `max` characters. */
const longText = (label: string, max: number) =>
  normalised(label)
    .refine((s) => s.length <= max, {
      message: `The ${label} must be at most ${max.toLocaleString('en-US')} characters.`,
    })
    .refine((s) => !CONTROL_EXCEPT_BREAKS.test(s), {
      message: `The ${label} has a control character that cannot be printed; type it again or paste it as plain text.`,
    });

/** One line of text, at most `max` characters. */
const oneLine = (label: string, max: number) =>
  z
    .string({ message: `The ${label} must be text.` })
    .trim()
    .max(max, { message: `The ${label} must be at most ${max} characters.` })
    .refine((s) => !CONTROL_ANY.test(s), { message: `The ${label} must be one line of plain text.` });

/** Empty, or filled in by `rule` (its own words when it is not met). */
const blankOr = (label: string, rule: z.ZodType<string, string>) =>
  z
    .string({ message: `The ${label} must be text.` })
    .trim()
    .transform((s, ctx) => {
      if (s === '') return '';
      const r = rule.safeParse(s);
      if (r.success) return r.data;
      for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message });
      return z.NEVER;
    });

export const proposalDetailsRules = {
  address: longText('address', ADDRESS_MAX).refine((s) => s.split('\n').length <= ADDRESS_LINES_MAX, {
    message: `Write the address on at most ${ADDRESS_LINES_MAX} lines.`,
  }),
  phone: blankOr(
    'phone number',
    z.string().regex(/^\+?[0-9(][0-9 ().-]{5,38}$/, {
      message: 'Enter a phone number using digits, spaces, dashes, dots or brackets.',
    }),
  ),
  email: blankOr('e-mail address', emailRule),
  licence: oneLine('licence text', LICENCE_MAX),
  terms: longText('terms', PROPOSAL_TEXT_MAX),
  warranty: longText('warranty text', PROPOSAL_TEXT_MAX),
  cancellationExtra: longText('extra cancellation wording', PROPOSAL_TEXT_MAX),
};

/** The owner's PUT: the whole document, with If-Match. */
export const proposalDetailsBody = z.strictObject(proposalDetailsRules);
export type ProposalDetailsBody = z.input<typeof proposalDetailsBody>;

const timestamp = z.string().describe('ISO 8601 date-time');

/** The logo as the server keeps it: re-encoded PNG, its size in pixels and bytes. */
export const companyLogoRecord = z.object({
  width: z.number().int(),
  height: z.number().int(),
  bytes: z.number().int(),
  uploadedAt: timestamp,
  /** Where the office's screens read it (the bytes change URL with every upload). */
  url: z.string(),
});
export type CompanyLogoRecord = z.output<typeof companyLogoRecord>;

export const proposalDetailsRecord = z.object({
  address: z.string(),
  phone: z.string(),
  email: z.string(),
  licence: z.string(),
  terms: z.string(),
  warranty: z.string(),
  cancellationExtra: z.string(),
  logo: companyLogoRecord.nullable(),
  /** 0 until the owner first saves; send it back as If-Match: "0". */
  version: z.number().int(),
  updatedAt: timestamp.nullable(),
});
export type ProposalDetailsRecord = z.output<typeof proposalDetailsRecord>;

export const proposalDetailsResponse = z.object({ details: proposalDetailsRecord });
