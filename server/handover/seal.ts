import {
  createCipheriv,
  createDecipheriv,
  createHash,
  createPrivateKey,
  createPublicKey,
  generateKeyPairSync,
  hkdfSync,
  randomBytes,
  sign,
  verify,
} from 'node:crypto';

/**
 * The seal over an issued pack: an Ed25519 signature (RFC 8032) over a short text naming the
 * pack number, the issue time and the SHA-256 of the PDF's bytes. Anyone holding the
 * published public key can check it with any Ed25519 implementation, not only Wardbook.
 */

export const SEAL_TEXT_HEADER = 'Wardbook handover pack seal v1';

export function sealText(input: { packNumber: string; issuedAt: Date; sha256: string }): string {
  return [
    SEAL_TEXT_HEADER,
    `pack: ${input.packNumber}`,
    `issued: ${input.issuedAt.toISOString()}`,
    `sha256: ${input.sha256}`,
    '',
  ].join('\n');
}

export const sha256Hex = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

/** Private keys rest in the database encrypted under a key derived from the data folder's secret. */
function keyEncryptionKey(secret: string): Buffer {
  return Buffer.from(hkdfSync('sha256', secret, 'wardbook', 'seal private keys v1', 32));
}

export interface GeneratedSealKey {
  publicKeyPem: string;
  privateKeySealed: string;
}

export function generateSealKey(secret: string): GeneratedSealKey {
  const { publicKey, privateKey } = generateKeyPairSync('ed25519');
  const der = privateKey.export({ type: 'pkcs8', format: 'der' });
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', keyEncryptionKey(secret), iv);
  const encrypted = Buffer.concat([cipher.update(der), cipher.final()]);
  return {
    publicKeyPem: publicKey.export({ type: 'spki', format: 'pem' }).toString(),
    privateKeySealed: ['v1', iv, cipher.getAuthTag(), encrypted]
      .map((part) => (typeof part === 'string' ? part : part.toString('base64url')))
      .join('.'),
  };
}

function openPrivateKey(sealed: string, secret: string) {
  const [version, iv, tag, encrypted] = sealed.split('.');
  if (version !== 'v1' || !iv || !tag || !encrypted) throw new Error('unknown sealed key format');
  const decipher = createDecipheriv(
    'aes-256-gcm',
    keyEncryptionKey(secret),
    Buffer.from(iv, 'base64url'),
  );
  decipher.setAuthTag(Buffer.from(tag, 'base64url'));
  const der = Buffer.concat([
    decipher.update(Buffer.from(encrypted, 'base64url')),
    decipher.final(),
  ]);
  return createPrivateKey({ key: der, format: 'der', type: 'pkcs8' });
}

/** Signs the seal text; the signature travels as base64. */
export function signSealText(text: string, privateKeySealed: string, secret: string): string {
  return sign(null, Buffer.from(text, 'utf8'), openPrivateKey(privateKeySealed, secret)).toString(
    'base64',
  );
}

export function verifySealText(text: string, signature: string, publicKeyPem: string): boolean {
  try {
    return verify(
      null,
      Buffer.from(text, 'utf8'),
      createPublicKey(publicKeyPem),
      Buffer.from(signature, 'base64'),
    );
  } catch {
    return false;
  }
}

/** A short, stable name for a public key: the first 16 hex digits of its SPKI's SHA-256. */
export function keyFingerprint(publicKeyPem: string): string {
  const der = createPublicKey(publicKeyPem).export({ type: 'spki', format: 'der' });
  return createHash('sha256').update(der).digest('hex').slice(0, 16);
}
