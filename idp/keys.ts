import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { exportJWK, generateKeyPair, type JWK } from 'jose';

export interface Jwks {
  keys: JWK[];
}

export async function generateSigningKeys(): Promise<Jwks> {
  // RS256 is the default ID token algorithm every OIDC client accepts; EdDSA is offered too.
  const rsa = await generateKeyPair('RS256', { extractable: true, modulusLength: 2048 });
  const ed = await generateKeyPair('EdDSA', { extractable: true, crv: 'Ed25519' });
  return {
    keys: [
      { ...(await exportJWK(rsa.privateKey)), kid: randomUUID(), alg: 'RS256', use: 'sig' },
      { ...(await exportJWK(ed.privateKey)), kid: randomUUID(), alg: 'EdDSA', use: 'sig' },
    ],
  };
}

/**
 * Signing keys are made at first start and kept in the data folder, out of git. To rotate,
 * put a new key first in the file and keep the old one after it until its tokens expire.
 */
export async function loadOrCreateSigningKeys(dataDir: string): Promise<Jwks> {
  const file = path.join(dataDir, 'idp', 'jwks.json');
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as Jwks;
  mkdirSync(path.dirname(file), { recursive: true });
  const jwks = await generateSigningKeys();
  writeFileSync(file, JSON.stringify(jwks, null, 2), { mode: 0o600 });
  return jwks;
}
