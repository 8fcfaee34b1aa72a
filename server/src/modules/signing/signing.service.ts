import { createHash, randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import {
  acceptanceStatement,
  disclosureText,
  esignDisclosure,
  ESIGN_DISCLOSURE_VERSION,
  proposalSnapshot,
  type ConsentBody,
  type ProposalSnapshot,
  type SignatureBody,
  type SigningState,
} from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { LinkGrant } from '../../lib/route';
import type { Queue } from '../../services/queue';
import type { Clock } from '../../services/services';
import type { Storage } from '../../services/storage';
import type { RequestMeta } from '../../lib/request-meta';
import { moveJobForProposal } from '../jobs/job-moves';
import { ProposalEventSchema } from '../proposals/proposal.entity';
import { checkSignatureImage } from './signature-image';

/**
 * Signing a proposal (issue 14): the customer's consent to sign electronically (ESIGN, 15 U.S.C.
 * §7001(c)(1)), then the signature on the current version, each with its audit event in the same
 * transaction. The signature row is insert-only in PostgreSQL (migration …040000_proposal_signatures).
 * Everything here works for the customer of a proposal link: the company and proposal come from the
 * link's grant, never from the request body.
 */

const sha256 = (text: string | Buffer) => createHash('sha256').update(text).digest('hex');

export type { RequestMeta } from '../../lib/request-meta';

interface CurrentVersion {
  id: string;
  number: number;
  proposalId: string;
  jobId: string;
  snapshot: ProposalSnapshot;
  snapshotSha256: string;
  pdfSha256: string | null;
}

/** The proposal's current (not superseded) version; `lock` holds it until the transaction ends. */
async function currentVersion(em: EntityManager, grant: LinkGrant, lock = false): Promise<CurrentVersion> {
  const rows = await em.execute<
    Array<{
      id: string;
      number: number;
      snapshot: unknown;
      snapshot_sha256: string;
      pdf_sha256: string | null;
      job_id: string;
    }>
  >(
    `select v."id", v."number", v."snapshot", v."snapshot_sha256", v."pdf_sha256", p."job_id"
       from "proposal_version" v join "proposal" p on p."id" = v."proposal_id"
      where v."company_id" = ? and v."proposal_id" = ? and v."superseded_at" is null
      ${lock ? 'for update of v' : ''}`,
    [grant.companyId, grant.proposalId],
  );
  const row = rows[0];
  if (!row) throw new NotFoundError('The proposal');
  return {
    id: row.id,
    number: row.number,
    proposalId: grant.proposalId,
    jobId: row.job_id,
    snapshot: proposalSnapshot.parse(row.snapshot),
    snapshotSha256: row.snapshot_sha256,
    pdfSha256: row.pdf_sha256,
  };
}

/** The option named by the version's latest option-chosen event (data.position), or null. */
async function chosenOption(em: EntityManager, companyId: string, version: CurrentVersion) {
  const rows = await em.execute<Array<{ position: string | null }>>(
    `select "data"->>'position' as "position" from "proposal_event"
      where "company_id" = ? and "version_id" = ? and "kind" = 'option-chosen' order by "seq" desc limit 1`,
    [companyId, version.id],
  );
  const position = Number(rows[0]?.position);
  return version.snapshot.options.find((o) => o.position === position) ?? null;
}

function disclosureOf(snapshot: ProposalSnapshot) {
  const paragraphs = esignDisclosure(snapshot.company);
  const text = disclosureText(paragraphs);
  return { paragraphs, text, sha256: sha256(text) };
}

function statementOf(version: CurrentVersion, option: ProposalSnapshot['options'][number]) {
  const text = acceptanceStatement({
    company: version.snapshot.company.name,
    versionNumber: version.number,
    optionPosition: option.position,
    optionName: option.name,
    totalCents: option.price.totalCents,
    depositCents: option.price.depositCents,
  });
  return { text, sha256: sha256(text) };
}

async function consentOf(em: EntityManager, companyId: string, versionId: string) {
  const rows = await em.execute<Array<{ at: Date; sha256: string | null }>>(
    `select "at", "data"->>'disclosureSha256' as "sha256" from "proposal_event"
      where "company_id" = ? and "version_id" = ? and "kind" = 'consented' order by "seq" desc limit 1`,
    [companyId, versionId],
  );
  return rows[0] ?? null;
}

export interface SignatureRow {
  id: string;
  company_id: string;
  proposal_id: string;
  version_id: string;
  option_position: number;
  signer_name: string;
  signer_email: string;
  method: 'drawn' | 'typed';
  image_key: string | null;
  typed_name: string | null;
  statement: string;
  statement_sha256: string;
  document_sha256: string;
  snapshot_sha256: string;
  consent_sha256: string;
  signed_at: Date;
  ip: string | null;
  user_agent: string | null;
}

export async function signatureOfVersion(
  em: EntityManager,
  companyId: string,
  versionId: string,
): Promise<SignatureRow | null> {
  const rows = await em.execute<SignatureRow[]>(
    'select * from "proposal_signature" where "company_id" = ? and "version_id" = ?',
    [companyId, versionId],
  );
  return rows[0] ?? null;
}

export interface SignedPdfRow {
  id: string;
  company_id: string;
  signature_id: string;
  storage_key: string;
  sha256: string;
  bytes: number;
  certificate_sha256: string;
  sealed_at: Date;
}

export async function signedPdfOf(em: EntityManager, companyId: string, signatureId: string) {
  const rows = await em.execute<SignedPdfRow[]>(
    'select * from "proposal_signed_pdf" where "company_id" = ? and "signature_id" = ?',
    [companyId, signatureId],
  );
  return rows[0] ?? null;
}

/** Whether the version has a signature (payments asks before a deposit; the office's screen too). */
export async function isVersionSigned(em: EntityManager, companyId: string, versionId: string): Promise<boolean> {
  return (await signatureOfVersion(em, companyId, versionId)) !== null;
}

/** What the customer's page shows about signing the current version. */
export async function signingState(em: EntityManager, grant: LinkGrant): Promise<SigningState> {
  const version = await currentVersion(em, grant);
  const option = await chosenOption(em, grant.companyId, version);
  const disclosure = disclosureOf(version.snapshot);
  const consent = await consentOf(em, grant.companyId, version.id);
  const signature = await signatureOfVersion(em, grant.companyId, version.id);
  const sealed = signature ? await signedPdfOf(em, grant.companyId, signature.id) : null;
  return {
    version: { number: version.number, pdfReady: version.pdfSha256 !== null },
    option: option
      ? {
          position: option.position,
          name: option.name,
          totalCents: option.price.totalCents,
          depositCents: option.price.depositCents,
        }
      : null,
    consent: {
      disclosureVersion: ESIGN_DISCLOSURE_VERSION,
      paragraphs: disclosure.paragraphs,
      sha256: disclosure.sha256,
      givenAt: consent && consent.sha256 === disclosure.sha256 ? new Date(consent.at).toISOString() : null,
    },
    statement: option ? statementOf(version, option) : null,
    signerDefaults: { name: version.snapshot.customer.name, email: version.snapshot.customer.email ?? '' },
    signature: signature
      ? {
          signedAt: new Date(signature.signed_at).toISOString(),
          signerName: signature.signer_name,
          method: signature.method,
          optionPosition: signature.option_position,
        }
      : null,
    signedPdf: signature ? (sealed ? 'ready' : 'waiting') : null,
  };
}

/** The version on the customer's screen must still be the current one. */
function assertCurrent(version: CurrentVersion, shown: number): void {
  if (shown !== version.number)
    throw new ConflictError(
      `This proposal was replaced by version ${version.number} after you opened it. Reload the page to read the new version before you go on.`,
      { reason: 'superseded', currentVersion: version.number },
    );
}

async function assertNotSigned(em: EntityManager, grant: LinkGrant, version: CurrentVersion): Promise<void> {
  if (await signatureOfVersion(em, grant.companyId, version.id))
    throw new ConflictError(
      `Version ${version.number} of this proposal is already signed. It cannot be signed again.`,
      {
        reason: 'signed',
      },
    );
}

export interface SigningDeps {
  readonly clock: Clock;
}

/**
 * The consent step: records a `consented` event for the current version holding the disclosure's
 * version, the SHA-256 of the exact text shown and the text itself. The hash the page sends must be the
 * text's now (a changed text is 409: read it again). Consenting twice records it once.
 */
export async function giveConsent(
  em: EntityManager,
  deps: SigningDeps,
  grant: LinkGrant,
  body: ConsentBody,
  meta: RequestMeta,
): Promise<SigningState> {
  await em.transactional(async (tx) => {
    const version = await currentVersion(tx, grant, true);
    assertCurrent(version, body.versionNumber);
    await assertNotSigned(tx, grant, version);
    const disclosure = disclosureOf(version.snapshot);
    if (body.disclosureSha256 !== disclosure.sha256)
      throw new ConflictError(
        'The consent text changed since the page was opened. Reload the page and read it again.',
        {
          reason: 'disclosure-changed',
        },
      );
    const before = await consentOf(tx, grant.companyId, version.id);
    if (before?.sha256 === disclosure.sha256) return;
    tx.create(ProposalEventSchema, {
      company: grant.companyId,
      proposal: grant.proposalId,
      version: version.id,
      kind: 'consented',
      at: deps.clock.now(),
      byCustomer: true,
      ip: meta.ip,
      userAgent: meta.userAgent,
      data: {
        disclosureVersion: ESIGN_DISCLOSURE_VERSION,
        disclosureSha256: disclosure.sha256,
        disclosure: disclosure.text,
        law: '15 U.S.C. §7001(c)(1)',
      },
    });
    await tx.flush();
  });
  return signingState(em.fork(), grant);
}

export interface SignDeps extends SigningDeps {
  readonly storage: Storage;
  readonly queue: Queue;
}

/** The sealed PDF's task key: one per signature. */
export const sealJobKey = (signatureId: string) => `signed-proposal:${signatureId}`;

/**
 * The signature: on the current version only, after consent, with the option the customer chose and the
 * statement they were shown. In one transaction (the version row locked): the insert-only signature row,
 * the `signed` event (data: the signature id, the signer), the job moved to won when the option asks no
 * deposit (after14 moves it once a deposit is paid), and the task that makes the sealed PDF.
 */
export async function signVersion(
  em: EntityManager,
  deps: SignDeps,
  grant: LinkGrant,
  body: SignatureBody,
  meta: RequestMeta,
): Promise<SigningState> {
  // The drawing is checked (and re-encoded) before anything is written.
  const image = body.method === 'drawn' ? await checkSignatureImage(body.image) : null;
  const signatureId = randomUUID();
  const imageKey = image ? `signature-${signatureId}` : null;
  let stored = false;
  try {
    await em.transactional(async (tx) => {
      const version = await currentVersion(tx, grant, true);
      assertCurrent(version, body.versionNumber);
      await assertNotSigned(tx, grant, version);
      const disclosure = disclosureOf(version.snapshot);
      const consent = await consentOf(tx, grant.companyId, version.id);
      if (!consent || consent.sha256 !== disclosure.sha256)
        throw new ConflictError('Agree to sign electronically first: read the consent and tick the box.', {
          reason: 'no-consent',
        });
      const option = await chosenOption(tx, grant.companyId, version);
      if (!option) throw new ConflictError('Choose one of the options before signing.', { reason: 'no-option' });
      if (option.position !== body.optionPosition)
        throw new ConflictError(
          `The option chosen is now option ${option.position}, “${option.name}”. Reload the page and check it before signing.`,
          { reason: 'option-changed' },
        );
      if (version.pdfSha256 === null)
        throw new ConflictError('The proposal’s document is still being prepared. Try again in a minute.', {
          reason: 'pdf-waiting',
        });
      const statement = statementOf(version, option);
      if (body.statementSha256 !== statement.sha256)
        throw new ConflictError('The words you were asked to sign have changed. Reload the page and read them again.', {
          reason: 'statement-changed',
        });
      const at = deps.clock.now();
      if (image && imageKey) {
        await deps.storage.put(imageKey, image.png, 'image/png');
        stored = true;
      }
      await tx.execute(
        `insert into "proposal_signature" ("id", "company_id", "proposal_id", "version_id", "option_position",
           "signer_name", "signer_email", "method", "image_key", "typed_name", "statement", "statement_sha256",
           "document_sha256", "snapshot_sha256", "consent_sha256", "signed_at", "ip", "user_agent")
         values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [
          signatureId,
          grant.companyId,
          grant.proposalId,
          version.id,
          option.position,
          body.signerName,
          body.signerEmail,
          body.method,
          imageKey,
          body.method === 'typed' ? body.typedName : null,
          statement.text,
          statement.sha256,
          version.pdfSha256,
          version.snapshotSha256,
          disclosure.sha256,
          at,
          meta.ip,
          meta.userAgent,
        ],
        'run',
      );
      tx.create(ProposalEventSchema, {
        company: grant.companyId,
        proposal: grant.proposalId,
        version: version.id,
        kind: 'signed',
        at,
        byCustomer: true,
        ip: meta.ip,
        userAgent: meta.userAgent,
        data: {
          signatureId,
          signerName: body.signerName,
          signerEmail: body.signerEmail,
          method: body.method,
          optionPosition: option.position,
          documentSha256: version.pdfSha256,
        },
      });
      await tx.flush();
      if (option.price.depositCents === 0)
        await moveJobForProposal(tx, { companyId: grant.companyId, jobId: version.jobId, to: 'won', at });
      await deps.queue.add('seal-signed-proposal', { signatureId }, { em: tx, jobKey: sealJobKey(signatureId) });
    });
  } catch (err) {
    if (stored && imageKey) await deps.storage.delete(imageKey).catch(() => undefined);
    throw err;
  }
  return signingState(em.fork(), grant);
}
