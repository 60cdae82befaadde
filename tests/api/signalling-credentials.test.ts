import { createHash } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { handleFrame } from '../../server/monitoring/receiver';
import { simulatedFrame } from '../../server/monitoring/simulator';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
beforeAll(() => {
  world = currentWorld();
});

const asOperator = () => harness.signedInAs(world.operator.userId);
const credentialsPath = (siteId: string) =>
  `/api/monitoring/sites/${siteId}/signalling-credentials`;
const tokenPath = (siteId: string) => `/api/monitoring/sites/${siteId}/intake-token`;
const keyOf = async (siteId: string) =>
  (await db('sites').where({ id: siteId }).first('dc09_key')).dc09_key as string | null;

describe('the DC-09 key', () => {
  it('is set by the centre’s operator, written upper-case, and never sent back', async () => {
    const { agent, csrfToken } = await asOperator();
    const key = ' 00112233445566778899aabbccddeeff ';
    const response = await agent
      .put(credentialsPath(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: key });
    expect(response.status).toBe(200);
    const account = (await db('sites').where({ id: world.own.siteId }).first()).monitoring_account;
    expect(response.body).toEqual({
      siteId: world.own.siteId,
      account,
      encryption: 'AES-128',
      intakeTokenIssuedAt: null,
    });
    expect(await keyOf(world.own.siteId)).toBe('00112233445566778899AABBCCDDEEFF');
    expect(JSON.stringify(response.body).toUpperCase()).not.toContain('00112233');

    // Not in the site as the screens read it, and not in the audit log.
    const site = await agent.get(`/api/sites/${world.own.siteId}`);
    expect(site.status).toBe(200);
    expect(JSON.stringify(site.body).toUpperCase()).not.toContain('00112233');
    const audit = await db('audit_log')
      .where({ entity_id: world.own.siteId, action: 'site.dc09_key_set' })
      .orderBy('id', 'desc')
      .first();
    expect(audit).toMatchObject({ organisation_id: world.centre.id });
    expect(JSON.stringify(audit).toUpperCase()).not.toContain('00112233');
  });

  it('then makes the receiver take only encrypted frames from the account', async () => {
    const account = (await db('sites').where({ id: world.own.siteId }).first()).monitoring_account;
    const signal = {
      format: 'adm-cid' as const,
      account,
      code: '130',
      zone: 2,
      partition: 1,
      qualifier: 'new' as const,
      sequence: 4321,
      receiver: '1',
      linePrefix: '1',
    };
    const key = (await keyOf(world.own.siteId))!;
    expect((await handleFrame({ db }, simulatedFrame(signal))).outcome).toBe(
      'duh:plain-from-keyed-account',
    );
    expect((await handleFrame({ db }, simulatedFrame(signal, new Date(), key))).outcome).toBe(
      'ack:stored',
    );
  });

  it('takes 192- and 256-bit keys, and clearing it goes back to plain frames', async () => {
    const { agent, csrfToken } = await asOperator();
    for (const [key, name] of [
      ['AB'.repeat(24), 'AES-192'],
      ['CD'.repeat(32), 'AES-256'],
    ] as const) {
      const response = await agent
        .put(credentialsPath(world.own.siteId))
        .set('x-csrf-token', csrfToken)
        .send({ dc09Key: key });
      expect(response.body.encryption).toBe(name);
    }
    const cleared = await agent
      .put(credentialsPath(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.encryption).toBeNull();
    expect(await keyOf(world.own.siteId)).toBeNull();
    expect(
      await db('audit_log')
        .where({ entity_id: world.own.siteId, action: 'site.dc09_key_cleared' })
        .first(),
    ).toBeDefined();
  });

  it('refuses keys of the wrong length or with non-hex digits, changing nothing', async () => {
    const { agent, csrfToken } = await asOperator();
    for (const body of [
      { dc09Key: 'ABC' },
      { dc09Key: 'A'.repeat(31) },
      { dc09Key: 'G'.repeat(32) },
      { dc09Key: 12 },
      {},
      { dc09Key: null, extra: true },
    ]) {
      const response = await agent
        .put(credentialsPath(world.own.siteId))
        .set('x-csrf-token', csrfToken)
        .send(body);
      expect(response.status, JSON.stringify(body)).toBe(400);
      expect(response.headers['content-type']).toContain('application/problem+json');
      expect(response.body.errors.length, JSON.stringify(body)).toBeGreaterThan(0);
    }
    const response = await agent
      .put(credentialsPath(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: 'A'.repeat(31) });
    expect(response.body.errors).toEqual([
      {
        path: 'body.dc09Key',
        message: 'The key is 32, 48 or 64 hex digits (0–9, A–F): AES-128, AES-192 or AES-256.',
      },
    ]);
    expect(await keyOf(world.own.siteId)).toBeNull();
  });

  it('is out of reach for another centre’s site (404) and for installers (403)', async () => {
    const { agent, csrfToken } = await asOperator();
    const other = await agent
      .put(credentialsPath(world.other.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: 'AB'.repeat(16) });
    expect(other.status).toBe(404);
    expect(await keyOf(world.other.siteId)).toBeNull();
    const notAnId = await agent
      .put(credentialsPath('not-a-site'))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: null });
    expect(notAnId.status).toBe(404);
    const office = await harness.signedInAs(world.office.userId);
    const refused = await office.agent
      .put(credentialsPath(world.own.siteId))
      .set('x-csrf-token', office.csrfToken)
      .send({ dc09Key: 'AB'.repeat(16) });
    expect(refused.status).toBe(403);
  });
});

describe('the HTTPS intake token', () => {
  it('is shown once and stored only as its SHA-256', async () => {
    const { agent, csrfToken } = await asOperator();
    const response = await agent.post(tokenPath(world.own.siteId)).set('x-csrf-token', csrfToken);
    expect(response.status).toBe(201);
    expect(response.headers['cache-control']).toBe('no-store');
    const { token, issuedAt } = response.body;
    expect(token).toMatch(/^wbi_[A-Za-z0-9_-]{43}$/);
    const row = await db('sites').where({ id: world.own.siteId }).first();
    expect(row.intake_token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(row.intake_token_issued_at.toISOString()).toBe(issuedAt);
    expect(JSON.stringify(row)).not.toContain(token);
    const audit = await db('audit_log')
      .where({ entity_id: world.own.siteId, action: 'site.intake_token_issued' })
      .first();
    expect(JSON.stringify(audit)).not.toContain(token.slice(4));
    // The credentials now say a token was issued, and when.
    const credentials = await agent
      .put(credentialsPath(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ dc09Key: null });
    expect(credentials.body.intakeTokenIssuedAt).toBe(issuedAt);
  });

  it('is replaced by a new one, which is different', async () => {
    const { agent, csrfToken } = await asOperator();
    const first = await agent.post(tokenPath(world.own.siteId)).set('x-csrf-token', csrfToken);
    const second = await agent.post(tokenPath(world.own.siteId)).set('x-csrf-token', csrfToken);
    expect(second.body.token).not.toBe(first.body.token);
    const row = await db('sites').where({ id: world.own.siteId }).first('intake_token_hash');
    expect(row.intake_token_hash).toBe(
      createHash('sha256').update(second.body.token).digest('hex'),
    );
  });

  it('cannot be issued for another centre’s site', async () => {
    const { agent, csrfToken } = await asOperator();
    const response = await agent.post(tokenPath(world.other.siteId)).set('x-csrf-token', csrfToken);
    expect(response.status).toBe(404);
    const row = await db('sites').where({ id: world.other.siteId }).first('intake_token_hash');
    expect(row.intake_token_hash).toBeNull();
  });
});
