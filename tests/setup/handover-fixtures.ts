import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { ApiHarness } from './api-app';
import { createPerson } from './factories';
import { signaturePng } from './signature-png';

/** Letters only, unlikely to meet another test's: pack prefixes are unique across companies. */
export function randomPackPrefix() {
  const letters = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';
  return Array.from(randomBytes(5), (byte) => letters[byte % 26]).join('');
}

/** Gives the site's installer a pack prefix, if it has none yet. */
export async function ensurePackPrefix(db: Knex, siteId: string) {
  const site = await db('sites').where({ id: siteId }).first('installer_id');
  await db('organisations')
    .where({ id: site.installer_id })
    .whereNull('pack_prefix')
    .update({ pack_prefix: randomPackPrefix() });
  return site.installer_id as string;
}

/**
 * Puts a site’s handover draft in the state issue needs — both signatures, and written
 * variations enough to cover any blocking problem — straight into the database, for tests about what comes
 * after signing (the signing itself has its own tests).
 */
export async function signDraftDirectly(db: Knex, siteId: string, engineerUserId: string) {
  await db('handover_drafts').insert({ site_id: siteId }).onConflict('site_id').ignore();
  const blocking = 40;
  await db('handover_drafts')
    .where({ site_id: siteId })
    .update({
      variations: JSON.stringify(
        Array.from({ length: blocking }, (_, index) => ({
          text: `Accepted variation ${index + 1}`,
        })),
      ),
      engineer_signature: signaturePng(1),
      engineer_user_id: engineerUserId,
      engineer_name: 'Test Engineer',
      engineer_signed_at: db.fn.now(),
      customer_signature: signaturePng(2),
      customer_name: 'Test Customer',
      customer_signed_via: 'in_person',
      customer_signed_at: db.fn.now(),
      version: db.raw('version + 1'),
    });
}

export async function waitForBuild(
  agent: { get(path: string): PromiseLike<{ body: { build: { status: string } } }> },
  buildId: string,
) {
  for (let attempt = 0; attempt < 300; attempt += 1) {
    const { body } = await agent.get(`/api/handover-builds/${buildId}`);
    if (body.build.status === 'done' || body.build.status === 'failed')
      return body.build as { status: string; packNumber: string | null; error: string | null };
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('the pack build did not finish');
}

/** Issues a real pack for a site through the API, as an engineer of its installer. */
export async function issuePackThroughApi(harness: ApiHarness, db: Knex, siteId: string) {
  const installerId = await ensurePackPrefix(db, siteId);
  const engineer = await createPerson(db, {
    memberships: [{ role: 'engineer', organisationId: installerId }],
  });
  await signDraftDirectly(db, siteId, engineer.userId);
  const { agent, csrfToken } = await harness.signedInAs(engineer.userId);
  const issued = await agent
    .post(`/api/sites/${siteId}/handover/issue`)
    .set('x-csrf-token', csrfToken);
  if (issued.status !== 202) throw new Error(`issue refused: ${JSON.stringify(issued.body)}`);
  const build = await waitForBuild(agent, issued.body.build.id);
  if (build.status !== 'done') throw new Error(`build failed: ${build.error}`);
  return { packNumber: build.packNumber!, buildId: issued.body.build.id as string };
}
