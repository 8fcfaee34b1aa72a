import { createHash, randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { proposalSnapshot } from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import { logger } from '../../lib/logger';
import type { ServiceContext } from '../../lib/service-context';
import type { Queue } from '../../services/queue';
import { loadSealCertificate, type SealCertificate } from '../../services/seal-certificate';
import type { Services } from '../../services/services';
import type { Storage } from '../../services/storage';
import type { TaskRun } from '../../tasks/kinds';
import { cancelWindow } from '../cancellations/cancellation-window';
import { findJob } from '../jobs/job-access';
import { queueMessage } from '../mail/mail.service';
import { line } from '../proposals/pdf/format';
import { loadLogo } from '../proposals/pdf/logo';
import { renderProposalPdf } from '../proposals/pdf/render-proposal';
import { sealPdf } from '../proposals/pdf/seal';
import type { SignedRecord } from '../proposals/pdf/signed-record';
import { pdfFileName } from '../proposals/proposal-pdf.service';
import { signedPdfOf, type SignatureRow } from './signing.service';

/**
 * The signed copy (issue 14): made by the queue's `seal-signed-proposal` task after a signature. The
 * version's document is rendered again from its frozen snapshot with the signature on the acceptance
 * page and a signing record (audit page) after it, sealed with the deployment's certificate, stored
 * through services/storage, its SHA-256 recorded in the insert-only `proposal_signed_pdf` row and e-mailed
 * to the signer (attached) in the same transaction. Once recorded, the bytes are never made again: both
 * downloads serve the stored file.
 */

export const signedPdfKey = (signatureId: string) => `signed-proposal-${signatureId}`;

export interface SealDeps {
  readonly orm: Services['orm'];
  readonly storage: Storage;
  readonly queue: Queue;
  readonly clock: Services['clock'];
  readonly config: Pick<Services['config'], 'SEAL_P12_FILE' | 'SEAL_P12_PASSPHRASE'>;
}

let cached: { file: string; cert: Promise<SealCertificate> } | null = null;
/** The certificate, read once per process (per configured file). */
function certificateFor(config: SealDeps['config']): Promise<SealCertificate> {
  const file = config.SEAL_P12_FILE ?? '';
  if (!cached || cached.file !== file) {
    const cert = loadSealCertificate(config);
    cert.catch(() => (cached = null)); // a missing file is read again on the next try
    cached = { file, cert };
  }
  return cached.cert;
}

/** Who did each event, in the audit page's words. */
async function trailUntil(em: EntityManager, signature: SignatureRow) {
  const rows = await em.execute<
    Array<{
      seq: string;
      kind: string;
      at: Date;
      by_customer: boolean;
      user_name: string | null;
      by_user_id: string | null;
    }>
  >(
    `select e."seq", e."kind", e."at", e."by_customer", e."by_user_id", u."name" as "user_name"
       from "proposal_event" e left join "app_user" u on u."id" = e."by_user_id"
      where e."company_id" = ? and e."proposal_id" = ?
        and e."seq" <= (select s."seq" from "proposal_event" s where s."company_id" = ? and s."kind" = 'signed'
                         and s."data"->>'signatureId' = ?)
      order by e."seq"`,
    [signature.company_id, signature.proposal_id, signature.company_id, signature.id],
  );
  return rows.map((r) => ({
    seq: Number(r.seq),
    kind: r.kind,
    at: new Date(r.at),
    by: r.by_customer ? 'The customer' : r.by_user_id ? (r.user_name ?? 'A former user') : 'Gaugeline',
  }));
}

/**
 * One try of the task. A signature whose sealed PDF is recorded is left alone (a job that runs twice
 * seals once); a failure goes back to the queue, which tries again with back-off.
 */
export async function sealSignedProposal(deps: SealDeps, signatureId: string, _run: TaskRun): Promise<void> {
  const em = deps.orm.em.fork();
  const signature = (
    await em.execute<SignatureRow[]>('select * from "proposal_signature" where "id" = ?', [signatureId])
  )[0];
  if (!signature) {
    logger.warn({ signatureId }, 'seal-signed-proposal: no such signature; dropped');
    return;
  }
  if (await signedPdfOf(em, signature.company_id, signature.id)) return;
  const version = (
    await em.execute<Array<{ number: number; snapshot: unknown }>>(
      'select "number", "snapshot" from "proposal_version" where "id" = ? and "company_id" = ?',
      [signature.version_id, signature.company_id],
    )
  )[0];
  if (!version) throw new Error(`seal-signed-proposal: the version of signature ${signatureId} is missing`);
  const consent = (
    await em.execute<Array<{ at: Date; version: string; sha256: string }>>(
      `select "at", "data"->>'disclosureVersion' as "version", "data"->>'disclosureSha256' as "sha256"
         from "proposal_event" where "company_id" = ? and "version_id" = ? and "kind" = 'consented'
          and "data"->>'disclosureSha256' = ? order by "seq" desc limit 1`,
      [signature.company_id, signature.version_id, signature.consent_sha256],
    )
  )[0];
  if (!consent) throw new Error(`seal-signed-proposal: the consent of signature ${signatureId} is missing`);

  const snapshot = proposalSnapshot.parse(version.snapshot);
  const certificate = await certificateFor(deps.config);
  const image = signature.image_key ? await deps.storage.get(signature.image_key) : null;
  if (signature.image_key && !image)
    throw new Error(`seal-signed-proposal: the drawn signature ${signatureId} is missing`);
  const signed: SignedRecord = {
    signatureId: signature.id,
    optionPosition: signature.option_position,
    signerName: signature.signer_name,
    signerEmail: signature.signer_email,
    method: signature.method,
    image,
    typedName: signature.typed_name,
    statement: signature.statement,
    statementSha256: signature.statement_sha256,
    signedAt: new Date(signature.signed_at),
    ip: signature.ip,
    userAgent: signature.user_agent,
    documentSha256: signature.document_sha256,
    snapshotSha256: signature.snapshot_sha256,
    consent: { at: new Date(consent.at), disclosureVersion: consent.version, sha256: consent.sha256 },
    events: await trailUntil(em, signature),
    certificate: { commonName: certificate.commonName, sha256: certificate.certificateSha256 },
  };
  const logo = await loadLogo(deps.storage, snapshot.company.logoKey);
  // The right-to-cancel notice carries the transaction date: the job site's local date of the signing.
  const signedAt = new Date(signature.signed_at);
  const cancellation = { transactionDate: cancelWindow(signedAt, signedAt, snapshot.site.region).transactionDate };
  const pdf = await renderProposalPdf({ snapshot, versionNumber: version.number, logo, signed, cancellation });
  const sealedAt = deps.clock.now();
  const company = line(snapshot.company.name);
  const sealed = await sealPdf(pdf, certificate, {
    reason: `Proposal version ${version.number} signed by ${line(signature.signer_name)}`,
    name: company,
    contactInfo: line(snapshot.company.email ?? snapshot.company.phone ?? ''),
    location: 'Signed electronically',
    signingTime: sealedAt,
  });
  const sha256 = createHash('sha256').update(sealed).digest('hex');
  const key = signedPdfKey(signature.id);
  await deps.storage.put(key, sealed, 'application/pdf');
  const fileName = signedFileName(snapshot.customer.name, version.number);
  await em.transactional(async (tx) => {
    const inserted = await tx.execute<{ affectedRows?: number }>(
      `insert into "proposal_signed_pdf" ("id", "company_id", "signature_id", "storage_key", "sha256", "bytes",
         "certificate_sha256", "sealed_at") values (?, ?, ?, ?, ?, ?, ?, ?)
       on conflict ("signature_id") do nothing`,
      [
        randomUUID(),
        signature.company_id,
        signature.id,
        key,
        sha256,
        sealed.length,
        certificate.certificateSha256,
        sealedAt,
      ],
      'run',
    );
    if (inserted.affectedRows !== 1) return; // another try recorded it first
    await queueMessage(tx, deps.queue, {
      companyId: signature.company_id,
      kind: 'signed-proposal',
      to: signature.signer_email,
      subject: `Your signed proposal from ${company}`,
      text: signedCopyText({
        signerName: line(signature.signer_name),
        company,
        versionNumber: version.number,
        sha256,
        phone: snapshot.company.phone ? line(snapshot.company.phone) : null,
        email: snapshot.company.email ? line(snapshot.company.email) : null,
      }),
      attachment: { key, name: fileName },
    });
  });
}

/** "proposal-pat-quinlan-v2-signed.pdf". */
export const signedFileName = (customerName: string, number: number) =>
  pdfFileName(customerName, number).replace(/\.pdf$/, '-signed.pdf');

function signedCopyText(m: {
  signerName: string;
  company: string;
  versionNumber: number;
  sha256: string;
  phone: string | null;
  email: string | null;
}): string {
  const reach = [m.phone, m.email].filter((x): x is string => x !== null).join(' or ');
  return [
    `Hello ${m.signerName},`,
    '',
    `Thank you for signing version ${m.versionNumber} of the proposal from ${m.company}. Your signed copy is attached as a PDF. Please keep it: it is your record of what you agreed to, and it includes the notice of your right to cancel.`,
    '',
    `The file is sealed with a digital signature, so a PDF reader can show that it has not been changed. Its SHA-256 fingerprint is ${m.sha256}.`,
    '',
    reach
      ? `Questions, or would you like a paper copy? Contact ${m.company} at ${reach}.`
      : `Questions, or would you like a paper copy? Contact ${m.company}.`,
  ].join('\n');
}

/** The stored signed copy of a signature; 409 while the queue is still making it. */
async function storedSignedPdf(
  storage: Storage,
  em: EntityManager,
  signature: SignatureRow,
  customerName: string,
  number: number,
) {
  const row = await signedPdfOf(em, signature.company_id, signature.id);
  if (!row) throw new ConflictError('The signed copy is still being prepared.', { reason: 'signed-pdf-waiting' });
  const bytes = await storage.get(row.storage_key);
  if (bytes === null) throw new NotFoundError('The signed PDF file');
  return { bytes, sha256: row.sha256, fileName: signedFileName(customerName, number) };
}

/** The customer's download: the signed copy of the proposal's signed version (the latest one signed). */
export async function customerSignedPdf(em: EntityManager, storage: Storage, companyId: string, proposalId: string) {
  const rows = await em.execute<Array<SignatureRow & { number: number; snapshot: unknown }>>(
    `select s.*, v."number", v."snapshot" from "proposal_signature" s join "proposal_version" v on v."id" = s."version_id"
      where s."company_id" = ? and s."proposal_id" = ? order by s."signed_at" desc limit 1`,
    [companyId, proposalId],
  );
  const row = rows[0];
  if (!row) throw new ConflictError('This proposal has not been signed yet.', { reason: 'not-signed' });
  const snapshot = proposalSnapshot.parse(row.snapshot);
  return storedSignedPdf(storage, em, row, snapshot.customer.name, row.number);
}

/** The office's download of a version's signed copy (404 for another company's job, 409 unsigned or not ready). */
export async function officeSignedPdf(ctx: ServiceContext & { storage: Storage }, jobId: string, number: number) {
  const job = await findJob(ctx, jobId);
  const rows = await ctx.em.execute<Array<SignatureRow & { snapshot: unknown }>>(
    `select s.*, v."snapshot" from "proposal_signature" s
       join "proposal_version" v on v."id" = s."version_id"
       join "proposal" p on p."id" = v."proposal_id"
      where s."company_id" = ? and p."job_id" = ? and v."number" = ?`,
    [ctx.actor.companyId, job.id, number],
  );
  const row = rows[0];
  if (!row) {
    const exists = await ctx.em.execute<Array<{ id: string }>>(
      `select v."id" from "proposal_version" v join "proposal" p on p."id" = v."proposal_id"
        where v."company_id" = ? and p."job_id" = ? and v."number" = ?`,
      [ctx.actor.companyId, job.id, number],
    );
    if (!exists[0]) throw new NotFoundError('The proposal version');
    throw new ConflictError('This version has not been signed.', { reason: 'not-signed' });
  }
  const snapshot = proposalSnapshot.parse(row.snapshot);
  return storedSignedPdf(ctx.storage, ctx.em, row, snapshot.customer.name, number);
}
