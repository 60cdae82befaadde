import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';

/**
 * Single-use links that let a person choose a password: after "forgotten password", or when
 * invited to Wardbook. Only a hash of each token is stored.
 */
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

const sha256 = (value: string) => createHash('sha256').update(value).digest('hex');

/** Creates a single-use link token; only its hash is stored. Invitations use the same table. */
export async function issuePasswordToken(
  db: Knex,
  accountId: string,
  purpose: 'reset' | 'invitation',
  validMinutes: number,
): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await db('idp.password_tokens').insert({
    account_id: accountId,
    purpose,
    token_hash: sha256(token),
    expires_at: new Date(Date.now() + validMinutes * 60 * 1000),
  });
  return token;
}

interface TokenRow {
  id: string;
  account_id: string;
  purpose: 'reset' | 'invitation';
}

export async function usableToken(db: Knex, token: string): Promise<TokenRow | undefined> {
  if (!TOKEN.test(token)) return undefined;
  return db('idp.password_tokens')
    .where({ token_hash: sha256(token) })
    .whereNull('used_at')
    .where('expires_at', '>', db.fn.now())
    .first<TokenRow | undefined>('id', 'account_id', 'purpose');
}
