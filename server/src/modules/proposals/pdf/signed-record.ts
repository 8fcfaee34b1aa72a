/**
 * What the signed copy of a version prints beyond the proposal itself (the signing slice of issue 14):
 * the signature on the acceptance page and the audit page. Built by modules/signing from the insert-only
 * signature row and the audit trail; every string from a person is printed through `line()`.
 */
export interface SignedRecord {
  readonly signatureId: string;
  readonly optionPosition: number;
  readonly signerName: string;
  readonly signerEmail: string;
  readonly method: 'drawn' | 'typed';
  /** The drawn mark as stored (PNG), or null for a typed signature. */
  readonly image: Buffer | null;
  readonly typedName: string | null;
  readonly statement: string;
  readonly statementSha256: string;
  readonly signedAt: Date;
  readonly ip: string | null;
  readonly userAgent: string | null;
  /** SHA-256 of the version's PDF the customer signed, and of its frozen snapshot. */
  readonly documentSha256: string;
  readonly snapshotSha256: string;
  readonly consent: { readonly at: Date; readonly disclosureVersion: string; readonly sha256: string };
  /** The proposal's audit trail up to and including the signature, in order. */
  readonly events: readonly { seq: number; kind: string; at: Date; by: string }[];
  /** The certificate that seals the file. */
  readonly certificate: { readonly commonName: string; readonly sha256: string };
}

/** A time in UTC as the audit page prints it: "2026-12-05 14:03:27 UTC". */
export const utc = (d: Date): string => `${d.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
