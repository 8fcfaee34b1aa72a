import { createHash, generateKeyPairSync, randomBytes } from 'node:crypto';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';
import forge from 'node-forge';
import type { Config } from '../config';

/**
 * The deployment's sealing certificate: a PKCS#12 file (certificate and private key) named by
 * SEAL_P12_FILE with SEAL_P12_PASSPHRASE. Signed proposals' PDFs are sealed with it (PDF digital
 * signature, modules/proposals/pdf/seal.ts), so any later change to a signed file shows in a reader.
 *
 * A real deployment configures its own certificate. For a laptop, `npm start`, `npm run dev`, the worker
 * script and the tests make a self-signed one under .data/ (never committed) with
 * `ensureLocalSealCertificate`; a reader then says the signature is intact but the signer unknown.
 */
export interface SealCertificate {
  readonly p12: Buffer;
  readonly passphrase: string;
  /** SHA-256 of the certificate (DER): recorded with each sealed PDF. */
  readonly certificateSha256: string;
  /** The certificate's common name, printed on the audit page. */
  readonly commonName: string;
}

/** Where the local self-signed certificate is kept. */
export const LOCAL_SEAL_FILE = '.data/seal/local-seal.p12';
export const LOCAL_SEAL_PASSPHRASE = 'gaugeline-local-seal';

/** Reads the configured certificate; a missing setting or an unreadable file is an error naming the setting. */
export async function loadSealCertificate(config: Pick<Config, 'SEAL_P12_FILE' | 'SEAL_P12_PASSPHRASE'>) {
  if (!config.SEAL_P12_FILE)
    throw new Error('No sealing certificate: set SEAL_P12_FILE (a PKCS#12 file) and SEAL_P12_PASSPHRASE.');
  const p12 = await readFile(config.SEAL_P12_FILE);
  return describeP12(p12, config.SEAL_P12_PASSPHRASE);
}

export function describeP12(p12: Buffer, passphrase: string): SealCertificate {
  let cert: forge.pki.Certificate | undefined;
  try {
    const parsed = forge.pkcs12.pkcs12FromAsn1(
      forge.asn1.fromDer(forge.util.createBuffer(p12.toString('binary'))),
      passphrase,
    );
    const certBag = forge.pki.oids.certBag as string;
    const bags: forge.pkcs12.Bag[] = parsed.getBags({ bagType: certBag })[certBag] ?? [];
    cert = bags.find((b) => b.cert)?.cert;
  } catch (err) {
    throw new Error(`The sealing certificate (SEAL_P12_FILE) could not be opened: ${(err as Error).message}`);
  }
  if (!cert) throw new Error('The sealing certificate (SEAL_P12_FILE) holds no certificate.');
  const der = Buffer.from(forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes(), 'binary');
  const cn = cert.subject.getField('CN') as { value?: string } | null;
  return {
    p12,
    passphrase,
    certificateSha256: createHash('sha256').update(der).digest('hex'),
    commonName: cn?.value ?? 'unnamed certificate',
  };
}

/**
 * A self-signed sealing certificate for local use (RSA 2048, SHA-256, ten years), as PKCS#12 bytes.
 * The key pair comes from node:crypto (fast); node-forge writes the certificate and the PKCS#12.
 */
export function makeSelfSignedP12(passphrase: string, now = new Date()): Buffer {
  const pair = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const privateKey = forge.pki.privateKeyFromPem(pair.privateKey.export({ type: 'pkcs1', format: 'pem' }).toString());
  const publicKey = forge.pki.publicKeyFromPem(pair.publicKey.export({ type: 'spki', format: 'pem' }).toString());
  const cert = forge.pki.createCertificate();
  cert.publicKey = publicKey;
  cert.serialNumber = `01${randomBytes(8).toString('hex')}`;
  cert.validity.notBefore = new Date(now.getTime() - 60_000);
  cert.validity.notAfter = new Date(now.getTime() + 10 * 365 * 24 * 3600 * 1000);
  const attrs = [
    { name: 'commonName', value: 'Gaugeline local seal (self-signed, not for production)' },
    { name: 'organizationName', value: 'Gaugeline local development' },
  ];
  cert.setSubject(attrs);
  cert.setIssuer(attrs);
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
  ]);
  cert.sign(privateKey, forge.md.sha256.create());
  const asn1 = forge.pkcs12.toPkcs12Asn1(privateKey, [cert], passphrase, { algorithm: '3des' });
  return Buffer.from(forge.asn1.toDer(asn1).getBytes(), 'binary');
}

/** Makes the local self-signed certificate at `file` unless one is there; returns the file. */
export async function ensureLocalSealCertificate(file = LOCAL_SEAL_FILE, passphrase = LOCAL_SEAL_PASSPHRASE) {
  try {
    describeP12(await readFile(file), passphrase);
    return file;
  } catch {
    // missing or not ours: make it
  }
  await mkdir(dirname(file), { recursive: true });
  const tmp = `${file}.${randomBytes(6).toString('hex')}.tmp`;
  await writeFile(tmp, makeSelfSignedP12(passphrase), { mode: 0o600 });
  await rename(tmp, file);
  return file;
}
