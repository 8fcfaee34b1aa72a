import { Text, View } from '@react-pdf/renderer';
import { line } from './format';
import { Table } from './parts';
import type { SignedRecord } from './signed-record';
import { utc } from './signed-record';
import { COLORS, s } from './styles';

function Field({ label, value, mono }: { label: string; value: string; mono?: boolean }) {
  return (
    <View style={{ flexDirection: 'row', marginBottom: 3 }} wrap={false}>
      <Text style={[s.small, { width: 130, paddingTop: 1 }]}>{label}</Text>
      <Text style={[{ flex: 1 }, mono ? { fontSize: 8.5, color: COLORS.ink } : {}]}>{value}</Text>
    </View>
  );
}

/** Event kinds in the trail, in words for the audit page. */
const KIND_WORDS: Record<string, string> = {
  issued: 'Version issued',
  superseded: 'Version replaced',
  sent: 'Sent to the customer',
  'send-failed': 'Sending failed',
  opened: 'Link opened',
  viewed: 'Proposal viewed',
  downloaded: 'PDF downloaded',
  'option-chosen': 'Option chosen',
  consented: 'Agreed to sign electronically',
  signed: 'Signed',
  paid: 'Deposit paid',
  refunded: 'Deposit refunded',
  cancelled: 'Cancelled',
  'link-revoked': 'Link withdrawn',
  'marked-lost': 'Marked lost',
  'pdf-ready': 'PDF made',
  'pdf-failed': 'PDF failed',
};

/**
 * The audit page of a signed copy: who signed (name, e-mail), when (UTC), from where (IP, browser), the
 * SHA-256 of the document they signed and of the version's data, the consent they gave, the trail of
 * events up to the signature, and how this file is sealed. Together with the seal, a later change to the
 * document or this page shows.
 */
export function AuditPage({ signed, versionNumber }: { signed: SignedRecord; versionNumber: number }) {
  return (
    <View>
      <Text style={s.h1}>Signing record</Text>
      <Text style={s.lead}>{`How proposal version ${versionNumber} was signed. Times are in UTC.`}</Text>

      <Text style={s.h2}>Signer</Text>
      <Field label="Name" value={line(signed.signerName)} />
      <Field label="E-mail" value={line(signed.signerEmail)} />
      <Field
        label="Signature"
        value={signed.method === 'drawn' ? 'Drawn on screen' : `Typed name: ${line(signed.typedName ?? '')}`}
      />
      <Field label="Signed at" value={utc(signed.signedAt)} />
      <Field label="IP address" value={signed.ip ?? 'not recorded'} />
      <Field label="Browser" value={line(signed.userAgent ?? 'not recorded')} />

      <Text style={s.h2}>Document signed</Text>
      <Field label="PDF signed (SHA-256)" value={signed.documentSha256} mono />
      <Field label="Proposal data (SHA-256)" value={signed.snapshotSha256} mono />
      <Field label="Statement signed (SHA-256)" value={signed.statementSha256} mono />
      <Field label="Signature id" value={signed.signatureId} mono />
      <Field label="Sealed by" value={line(signed.certificate.commonName)} />
      <Field label="Certificate (SHA-256)" value={signed.certificate.sha256} mono />
      <Text style={[s.small, { marginTop: 2 }]}>
        This file carries a PDF digital signature over all of its contents: a PDF reader shows whether it has changed
        since it was sealed.
      </Text>

      <Text style={s.h2}>Agreement to sign electronically</Text>
      <Field label="Agreed at" value={utc(signed.consent.at)} />
      <Field label="Disclosure" value={`${signed.consent.disclosureVersion} (ESIGN, 15 U.S.C. §7001(c))`} />
      <Field label="Disclosure (SHA-256)" value={signed.consent.sha256} mono />

      <Text style={s.h2}>Events up to the signature</Text>
      <Table
        columns={[
          { label: 'No.', flex: 0.6 },
          { label: 'Time (UTC)', flex: 2.4 },
          { label: 'What happened', flex: 3 },
          { label: 'By', flex: 2.2 },
        ]}
        rows={signed.events.map((e) => ({
          key: String(e.seq),
          cells: [String(e.seq), utc(e.at), KIND_WORDS[e.kind] ?? e.kind, line(e.by)],
        }))}
      />
    </View>
  );
}
