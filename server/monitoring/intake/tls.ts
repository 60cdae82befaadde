import { X509Certificate } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { generate } from 'selfsigned';

export interface IntakeTls {
  key: string;
  cert: string;
  /** Where the certificate is, for clients to trust it (`npm run simulate -- --https`). */
  certPath: string;
}

/** Renewed when less than this is left, so a long-running install never serves an expired one. */
const RENEW_WITHIN_MS = 30 * 24 * 60 * 60 * 1000;
const VALID_FOR_DAYS = 825;

/**
 * A self-signed certificate for 127.0.0.1 and localhost: the intake listens on loopback only,
 * so no public certificate authority could vouch for it anyway. Clients trust this certificate
 * itself (`ca`), not a chain.
 */
export async function generateIntakeCertificate(now = new Date()) {
  const pems = await generate([{ name: 'commonName', value: 'Wardbook signal intake' }], {
    keyType: 'ec',
    curve: 'P-256',
    algorithm: 'sha256',
    notBeforeDate: new Date(now.getTime() - 60_000),
    notAfterDate: new Date(now.getTime() + VALID_FOR_DAYS * 24 * 60 * 60 * 1000),
    extensions: [
      { name: 'basicConstraints', cA: false },
      { name: 'keyUsage', digitalSignature: true, critical: true },
      { name: 'extKeyUsage', serverAuth: true },
      {
        name: 'subjectAltName',
        altNames: [
          { type: 2, value: 'localhost' },
          { type: 7, ip: '127.0.0.1' },
        ],
      },
    ],
  });
  return { key: pems.private, cert: pems.cert };
}

function stillGood(certPem: string, now: Date) {
  try {
    const certificate = new X509Certificate(certPem);
    return new Date(certificate.validTo).getTime() - now.getTime() > RENEW_WITHIN_MS;
  } catch {
    return false;
  }
}

/** Written beside, then renamed into place, so a reader never sees half a file. */
function writeAtomically(file: string, text: string, mode: number) {
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, text, { mode });
  renameSync(temporary, file);
}

/**
 * Like the other development secrets (server/config/secrets.ts), made on first start and kept
 * in the data folder: `intake-tls/key.pem` (readable by the owner only) and `cert.pem`.
 */
export async function loadOrCreateIntakeTls(dataDir: string, now = new Date()): Promise<IntakeTls> {
  const folder = path.join(dataDir, 'intake-tls');
  const keyPath = path.join(folder, 'key.pem');
  const certPath = path.join(folder, 'cert.pem');
  if (existsSync(keyPath) && existsSync(certPath)) {
    const kept = { key: readFileSync(keyPath, 'utf8'), cert: readFileSync(certPath, 'utf8') };
    if (stillGood(kept.cert, now)) return { ...kept, certPath };
  }
  mkdirSync(folder, { recursive: true, mode: 0o700 });
  const made = await generateIntakeCertificate(now);
  writeAtomically(keyPath, made.key, 0o600);
  writeAtomically(certPath, made.cert, 0o644);
  return { ...made, certPath };
}
