import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { hashPassword } from '../../idp/account';
import { newTotpSecret } from '../../idp/totp';
import type { OrganisationKind, Role } from '../../server/users/roles';

const unique = () => randomBytes(4).toString('hex');

export async function createOrganisation(db: Knex, kind: OrganisationKind, name?: string) {
  const [row] = await db('organisations')
    .insert({ kind, name: name ?? `Test ${kind} ${unique()}` })
    .returning<{ id: string; name: string }[]>(['id', 'name']);
  return row!;
}

export interface TestPerson {
  userId: string;
  accountId: string;
  email: string;
  displayName: string;
  password: string;
  totpSecret: string | null;
}

/**
 * A person as the IdP and the app both know them. `totp: 'enrolled'` gives them an
 * authenticator secret; 'none' leaves enrolment to their first sign-in.
 */
export async function createPerson(
  db: Knex,
  options: {
    memberships: { role: Role; organisationId?: string }[];
    totp?: 'enrolled' | 'none';
    name?: string;
  },
): Promise<TestPerson> {
  const tag = unique();
  const email = `person-${tag}@example.com`;
  const displayName = options.name ?? `Test Person ${tag}`;
  const password = `correct horse ${tag}`;
  const totpSecret = options.totp === 'enrolled' ? newTotpSecret() : null;
  const [account] = await db('idp.accounts')
    .insert({
      email,
      display_name: displayName,
      password_hash: await hashPassword(password),
      totp_secret: totpSecret,
    })
    .returning<{ id: string }[]>('id');
  const [user] = await db('users')
    .insert({ idp_subject: account!.id, email, display_name: displayName })
    .returning<{ id: string }[]>('id');
  for (const membership of options.memberships) {
    await db('memberships').insert({
      user_id: user!.id,
      role: membership.role,
      organisation_id: membership.organisationId ?? null,
    });
  }
  return { userId: user!.id, accountId: account!.id, email, displayName, password, totpSecret };
}
