import { plainAddPlaceholder } from '@signpdf/placeholder-plain';
import { P12Signer } from '@signpdf/signer-p12';
import { SignPdf } from '@signpdf/signpdf';
import type { SealCertificate } from '../../../services/seal-certificate';

export interface SealInfo {
  /** Why the document is signed (a reader shows it): "Signed by the buyer …". */
  readonly reason: string;
  /** Who seals it (the company). */
  readonly name: string;
  readonly contactInfo: string;
  readonly location: string;
  readonly signingTime: Date;
}

/** Room for the PKCS#7 signature (bytes): a 2048/4096-bit RSA certificate chain of a few certificates fits. */
const SIGNATURE_LENGTH = 16_384;

/**
 * Seals a finished PDF with a PDF digital signature (adbe.pkcs7.detached over the ByteRange, which is
 * the whole file but the signature itself): @signpdf/placeholder-plain adds the signature dictionary
 * and an incremental update, @signpdf/signer-p12 signs with the deployment's certificate. Any change to
 * a signed byte afterwards makes readers (and pdfsig) report the signature as broken.
 */
export async function sealPdf(pdf: Buffer, certificate: SealCertificate, info: SealInfo): Promise<Buffer> {
  const withPlaceholder = plainAddPlaceholder({
    pdfBuffer: pdf,
    reason: info.reason,
    contactInfo: info.contactInfo,
    name: info.name,
    location: info.location,
    signingTime: info.signingTime,
    signatureLength: SIGNATURE_LENGTH,
    appName: 'Gaugeline',
  });
  const signer = new P12Signer(certificate.p12, { passphrase: certificate.passphrase });
  return new SignPdf().sign(withPlaceholder, signer, info.signingTime);
}
