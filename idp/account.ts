import argon2 from 'argon2';
import type { Knex } from 'knex';
import type { Account, FindAccount } from 'oidc-provider';

export interface AccountRecord {
  id: string;
  email: string;
  display_name: string;
  password_hash: string | null;
  totp_secret: string | null;
  totp_pending_secret: string | null;
  totp_last_step: number | null;
  failed_attempts: number;
  locked_until: Date | null;
}

const ACCOUNTS = 'idp.accounts';
/** Roles that act for a company: engineer, office and operator need a second factor. */
const STAFF_ROLES = ['engineer', 'office', 'operator'];
const FREE_ATTEMPTS = 5;
const MAX_LOCK_MINUTES = 60;

// Verifying against this when the e-mail is unknown keeps the response time the same.
const decoyHash = argon2.hash('wardbook-decoy-password');

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export function findAccountByEmail(db: Knex, email: string) {
  return db<AccountRecord>(ACCOUNTS).whereRaw('lower(email) = lower(?)', [email.trim()]).first();
}

export function findAccountById(db: Knex, id: string) {
  return db<AccountRecord>(ACCOUNTS).where({ id }).first();
}

/** Roles come from Wardbook's memberships, so the IdP and the app never disagree. */
export async function rolesOf(db: Knex, accountId: string): Promise<string[]> {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('u.idp_subject', accountId)
    .whereNull('u.disabled_at')
    .distinct('m.role')
    .orderBy('m.role');
  return rows.map((row: { role: string }) => row.role);
}

export async function needsSecondFactor(db: Knex, account: AccountRecord): Promise<boolean> {
  if (account.totp_secret) return true;
  return (await rolesOf(db, account.id)).some((role) => STAFF_ROLES.includes(role));
}

export type PasswordCheck =
  | { ok: true; account: AccountRecord }
  | { ok: false; reason: 'invalid'; account?: AccountRecord }
  | { ok: false; reason: 'locked'; account: AccountRecord; retryAfterSeconds: number };

function lockedFor(account: AccountRecord, now: Date): number {
  if (!account.locked_until || account.locked_until <= now) return 0;
  return Math.ceil((account.locked_until.getTime() - now.getTime()) / 1000);
}

/** While an account is backing off, even the right password is refused. */
export async function checkPassword(
  db: Knex,
  email: string,
  password: string,
): Promise<PasswordCheck> {
  const account = await findAccountByEmail(db, email);
  if (!account?.password_hash) {
    await argon2.verify(await decoyHash, password);
    return { ok: false, reason: 'invalid', account };
  }
  const wait = lockedFor(account, new Date());
  if (wait > 0) return { ok: false, reason: 'locked', account, retryAfterSeconds: wait };
  if (!(await argon2.verify(account.password_hash, password))) {
    await recordFailedAttempt(db, account.id);
    return { ok: false, reason: 'invalid', account };
  }
  return { ok: true, account };
}

export function secondsLocked(account: AccountRecord): number {
  return lockedFor(account, new Date());
}

/**
 * Exponential backoff: after five failures in a row the account waits 1 minute, then 2, 4, …
 * up to an hour, before another attempt is even checked.
 */
export async function recordFailedAttempt(db: Knex, accountId: string): Promise<void> {
  await db(ACCOUNTS)
    .where({ id: accountId })
    .update({
      failed_attempts: db.raw('failed_attempts + 1'),
      locked_until: db.raw(
        `case when failed_attempts + 1 >= ? then now() + least(power(2, failed_attempts + 1 - ?), ?) * interval '1 minute' else locked_until end`,
        [FREE_ATTEMPTS, FREE_ATTEMPTS, MAX_LOCK_MINUTES],
      ),
      updated_at: db.fn.now(),
    });
}

export async function clearFailedAttempts(db: Knex, accountId: string): Promise<void> {
  await db(ACCOUNTS)
    .where({ id: accountId })
    .update({ failed_attempts: 0, locked_until: null, updated_at: db.fn.now() });
}

/** Records the accepted step; false if that step (or a later one) was already used. */
export async function claimTotpStep(db: Knex, accountId: string, step: number): Promise<boolean> {
  const updated = await db(ACCOUNTS)
    .where({ id: accountId })
    .andWhere((q) => q.whereNull('totp_last_step').orWhere('totp_last_step', '<', step))
    .update({ totp_last_step: step, updated_at: db.fn.now() });
  return updated === 1;
}

export function accountFinder(db: Knex): FindAccount {
  return async (_ctx, sub): Promise<Account | undefined> => {
    const account = await findAccountById(db, sub);
    if (!account) return undefined;
    return {
      accountId: account.id,
      async claims() {
        return {
          sub: account.id,
          email: account.email,
          email_verified: true,
          name: account.display_name,
          roles: await rolesOf(db, account.id),
        };
      },
    };
  };
}

/**
 * The account for someone invited by e-mail: no password until they follow their link. An
 * address that already has an account keeps it (and its password).
 */
export async function findOrCreateInvitedAccount(
  db: Knex,
  email: string,
  displayName: string,
): Promise<{ account: AccountRecord; created: boolean }> {
  const existing = await findAccountByEmail(db, email);
  if (existing) return { account: existing, created: false };
  const [account] = await db<AccountRecord>(ACCOUNTS)
    .insert({ email, display_name: displayName })
    .returning('*');
  return { account: account!, created: true };
}
