import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const secretsSchema = z.object({
  sessionSecret: z.string().min(32),
  oidcClientSecret: z.string().min(32),
  idpCookieKeys: z.array(z.string().min(32)).min(1),
  idpPendingLoginKey: z.string().min(32),
});

export type Secrets = z.infer<typeof secretsSchema>;

export function generateSecrets(): Secrets {
  const secret = () => randomBytes(32).toString('base64url');
  return {
    sessionSecret: secret(),
    oidcClientSecret: secret(),
    idpCookieKeys: [secret()],
    idpPendingLoginKey: secret(),
  };
}

/**
 * Development secrets are made on first start and kept in the data folder (git-ignored), so a
 * fresh clone never ships shared secrets and restarts keep sessions valid.
 */
export function loadOrCreateSecrets(dataDir: string): Secrets {
  const file = path.join(dataDir, 'secrets.json');
  if (existsSync(file)) {
    const parsed = secretsSchema.safeParse(JSON.parse(readFileSync(file, 'utf8')));
    if (parsed.success) return parsed.data;
    throw new Error(`${file} is not a valid secrets file; delete it to have new secrets made.`);
  }
  mkdirSync(dataDir, { recursive: true });
  const secrets = generateSecrets();
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  return secrets;
}
