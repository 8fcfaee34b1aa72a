import { Document } from '@react-pdf/renderer';
import type { ProposalSnapshot } from '@contract';
import { noticeForSnapshot, NoticeOfCancellation, type CancellationDates } from './cancellation-section';
import { CautionsSection, SignaturePage, TermsSection } from './closing-sections';
import { Cover } from './cover';
import { day, line } from './format';
import { LoadsSection } from './loads-section';
import type { Logo } from './logo';
import { OptionSection } from './option-section';
import { ProposalPage, type PageFrameText } from './parts';
import { AuditPage } from './audit-page';
import { SignedAcceptance } from './signature-page';
import type { SignedRecord } from './signed-record';

export interface ProposalDocumentProps {
  readonly snapshot: ProposalSnapshot;
  readonly versionNumber: number;
  readonly logo: Logo | null;
  /**
   * The signing's dates for the right-to-cancel notice (the job site's local date when the buyer signed);
   * null or absent on an unsigned version, whose notice prints blank lines for them.
   */
  readonly cancellation?: CancellationDates | null;
  /** The signed copy (modules/signing): the signature on the acceptance page and the signing record after it. */
  readonly signed?: SignedRecord;
}

/**
 * The proposal as a PDF, our own layout: a cover, the home's loads, one page (or more) per option with its
 * installation work, the terms, warranty and safety cautions, the acceptance page with the buyer's
 * right-to-cancel statement, and the Notice of Cancellation in duplicate (16 CFR 429.1). Everything printed
 * comes from the frozen snapshot, so the same version always prints the same words.
 */
export function ProposalDocument({
  snapshot,
  versionNumber,
  logo,
  cancellation = null,
  signed,
}: ProposalDocumentProps) {
  const customer = line(snapshot.customer.name);
  const notice = noticeForSnapshot(snapshot.company, cancellation);
  const frame: PageFrameText = {
    company: line(snapshot.company.name),
    title: `Proposal for ${customer} · version ${versionNumber}`,
    issued: `Issued ${day(snapshot.issuedAt)}`,
  };
  return (
    <Document
      title={`Proposal for ${customer}, version ${versionNumber}`}
      author={frame.company}
      subject="Heating and cooling proposal"
      creator="Gaugeline"
      producer="Gaugeline"
      language="en-US"
      creationDate={new Date(snapshot.issuedAt)}
      modificationDate={new Date(snapshot.issuedAt)}
    >
      <ProposalPage frame={frame} bookmark="Cover">
        <Cover snapshot={snapshot} versionNumber={versionNumber} logo={logo} />
      </ProposalPage>
      <ProposalPage frame={frame} bookmark="Your home’s loads">
        <LoadsSection snapshot={snapshot} />
      </ProposalPage>
      {snapshot.options.map((o) => (
        <ProposalPage key={o.position} frame={frame} bookmark={`Option ${o.position}: ${line(o.name)}`}>
          <OptionSection option={o} />
        </ProposalPage>
      ))}
      <ProposalPage frame={frame} bookmark="Terms, warranty and safety">
        <TermsSection company={snapshot.company} />
        <CautionsSection cautions={snapshot.cautions} />
      </ProposalPage>
      <ProposalPage frame={frame} bookmark="Acceptance">
        {signed ? (
          <SignedAcceptance snapshot={snapshot} versionNumber={versionNumber} signed={signed} notice={notice} />
        ) : (
          <SignaturePage snapshot={snapshot} versionNumber={versionNumber} notice={notice} />
        )}
      </ProposalPage>
      {([1, 2] as const).map((copy) => (
        <ProposalPage key={`notice-${copy}`} frame={frame} bookmark={`Notice of cancellation, copy ${copy}`}>
          <NoticeOfCancellation notice={notice} copy={copy} companyName={snapshot.company.name} />
        </ProposalPage>
      ))}
      {signed ? (
        <ProposalPage frame={frame} bookmark="Signing record">
          <AuditPage signed={signed} versionNumber={versionNumber} />
        </ProposalPage>
      ) : null}
    </Document>
  );
}
