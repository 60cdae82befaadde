import argon2 from 'argon2';
import type { Knex } from 'knex';
import { recordAuditEntry } from '../server/audit/repository';
import {
  DEMO_ACCOUNTS,
  DEMO_INSTALLER,
  DEMO_MONITORING_CENTRE,
  DEMO_PASSWORD,
} from './data/demo-scenario';

/**
 * Seeds the demo scenario once, into an empty database only: if any organisation exists the
 * database holds someone's data (or an earlier demo) and nothing is written.
 */
export async function seed(knex: Knex): Promise<void> {
  const { count } = (await knex('organisations').count<{ count: number }[]>('* as count'))[0]!;
  if (Number(count) > 0) return;

  const passwordHash = await argon2.hash(DEMO_PASSWORD, { type: argon2.argon2id });
  await knex.transaction(async (trx) => {
    const [installer] = await trx('organisations').insert(DEMO_INSTALLER).returning('id');
    const [centre] = await trx('organisations').insert(DEMO_MONITORING_CENTRE).returning('id');
    const organisationIds = { installer: installer.id, monitoring_centre: centre.id };

    for (const account of DEMO_ACCOUNTS) {
      const [idpAccount] = await trx('idp.accounts')
        .insert({
          email: account.email,
          display_name: account.displayName,
          password_hash: passwordHash,
          password_changed_at: trx.fn.now(),
          totp_secret: account.totpSecret,
        })
        .returning('id');
      const [user] = await trx('users')
        .insert({
          idp_subject: idpAccount.id,
          email: account.email,
          display_name: account.displayName,
        })
        .returning('id');
      await trx('memberships').insert({
        user_id: user.id,
        role: account.role,
        organisation_id: account.organisation ? organisationIds[account.organisation] : null,
      });
    }
    await recordAuditEntry(trx, {
      action: 'demo.seeded',
      organisationId: installer.id,
      summary: 'Demo scenario created: one installer, one monitoring centre, five accounts',
    });
  });
}
