import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const secretsSchema = z.object({
  sessionSecret: z.string().min(32),
  oidcClientSecret: z.string().min(32),
  idpCookieKeys: z.array(z.string().min(32)).min(1),
  idpPendingLoginKey: z.string().min(32),
  /** Encrypts the companies' seal private keys at rest (server/handover/seal.ts). */
  sealKeySecret: z.string().min(32),
  /** Shared by the app and the local Twilio fake: Basic auth to the API, and webhook signatures. */
  twilioAuthToken: z.string().regex(/^[0-9a-f]{32}$/),
});

export type Secrets = z.infer<typeof secretsSchema>;

export function generateSecrets(): Secrets {
  const secret = () => randomBytes(32).toString('base64url');
  return {
    sessionSecret: secret(),
    oidcClientSecret: secret(),
    idpCookieKeys: [secret()],
    idpPendingLoginKey: secret(),
    sealKeySecret: secret(),
    // Twilio's auth tokens are 32 hex digits; the local one has the same shape.
    twilioAuthToken: randomBytes(16).toString('hex'),
  };
}

/**
 * Development secrets are made on first start and kept in the data folder (git-ignored), so a
 * fresh clone never ships shared secrets and restarts keep sessions valid.
 */
export function loadOrCreateSecrets(dataDir: string): Secrets {
  const file = path.join(dataDir, 'secrets.json');
  let kept: Record<string, unknown> = {};
  if (existsSync(file)) {
    kept = JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown>;
    const parsed = secretsSchema.safeParse(kept);
    if (parsed.success) return parsed.data;
    // A data folder from an older Wardbook lacks the newer secrets: keep what is there, add the rest.
    const missingOnly = parsed.error.issues.every(
      (issue) => issue.code === 'invalid_type' && !(String(issue.path[0]) in kept),
    );
    if (!missingOnly)
      throw new Error(`${file} is not a valid secrets file; delete it to have new secrets made.`);
  }
  mkdirSync(dataDir, { recursive: true });
  const secrets = { ...generateSecrets(), ...kept } as Secrets;
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  return secrets;
}
