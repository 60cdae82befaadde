import { randomBytes } from 'node:crypto';
import { statSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { request as httpsRequest } from 'node:https';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/http/logger';
import { findCentreSite } from '../../server/monitoring/credentials/repository';
import { issueIntakeToken } from '../../server/monitoring/credentials/service';
import { createIntakeApp } from '../../server/monitoring/intake/app';
import { createIntakeServer } from '../../server/monitoring/intake/server';
import {
  generateIntakeCertificate,
  loadOrCreateIntakeTls,
} from '../../server/monitoring/intake/tls';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { createSiteRecord } from '../setup/site-fixtures';

const db = testDb();
const app = createIntakeApp({ db, logger: createLogger('silent', 'test') });
/** Two monitored sites, each with its own intake token. */
const own = { siteId: '', account: '', token: '' };
const other = { siteId: '', account: '', token: '' };

async function siteWithToken(target: typeof own) {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const { siteId } = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre.id,
  });
  const site = (await findCentreSite(db, [centre.id], siteId))!;
  const issued = await issueIntakeToken(db, site, { actorLabel: 'test' });
  Object.assign(target, { siteId, account: site.monitoring_account, token: issued.token });
}

beforeAll(async () => {
  await siteWithToken(own);
  await siteWithToken(other);
});
afterAll(closeTestDb);

let sequence = 1;
const burglary = (zone = 3) => ({
  account: own.account,
  sequence: sequence++,
  format: 'ADM-CID',
  data: `1130 01 ${String(zone).padStart(3, '0')}`,
  timestamp: new Date().toISOString(),
});

const post = (body: unknown, token: string | null = own.token) => {
  const pending = request(app).post('/v1/signals');
  return token === null
    ? pending.send(body as object)
    : pending.set('Authorization', `Bearer ${token}`).send(body as object);
};

describe('the HTTPS intake', () => {
  it('records a signal, files an event, and answers 201 only once it is committed', async () => {
    const body = burglary(4);
    const response = await post(body);
    expect(response.status).toBe(201);
    expect(response.body).toEqual({ signalId: expect.any(String), duplicate: false });
    const stored = await db('signals').where({ id: response.body.signalId }).first();
    expect(stored).toMatchObject({
      transport: 'https',
      protocol: 'ADM-CID',
      account: own.account,
      sequence: String(body.sequence).padStart(4, '0'),
      site_id: own.siteId,
      category: 'burglary',
      zone_or_user: 4,
      was_encrypted: false,
    });
    expect(stored.panel_time.toISOString()).toBe(body.timestamp);
    const event = await db('alarm_events').where({ id: stored.event_id }).first();
    expect(event).toMatchObject({ site_id: own.siteId, category: 'burglary', zones: [4] });
  });

  it('stores a resend once and says so', async () => {
    const body = burglary(5);
    const first = await post(body);
    const again = await post(body);
    expect(again.status).toBe(201);
    expect(again.body).toEqual({ signalId: first.body.signalId, duplicate: true });
    expect(
      await db('signals').where({ account: own.account, data: body.data }).count('* as n'),
    ).toEqual([{ n: 1 }]);
  });

  it('takes SIA-DCS too, with the account repeated in the data', async () => {
    const response = await post({
      account: own.account.toLowerCase(),
      sequence: String(sequence++),
      format: 'SIA-DCS',
      data: `#${own.account}|Nri1/FA07`,
    });
    expect(response.status).toBe(201);
    expect(await db('signals').where({ id: response.body.signalId }).first()).toMatchObject({
      category: 'fire',
      zone_or_user: 7,
      panel_time: null,
    });
  });

  it('refuses a missing, malformed or forged token with 401, storing nothing', async () => {
    const count = async () =>
      Number((await db('signals').where({ account: own.account }).count('* as n'))[0]!.n);
    const before = await count();
    for (const [token, label] of [
      [null, 'none'],
      [`wbi_${randomBytes(32).toString('base64url')}`, 'forged'],
      [own.token.slice(0, -1), 'truncated'],
    ] as const) {
      const response = await post(burglary(), token);
      expect(response.status, label).toBe(401);
      expect(response.headers['content-type'], label).toContain('application/problem+json');
      expect(response.headers['www-authenticate'], label).toContain('Bearer');
      expect(response.body, label).toMatchObject({ status: 401, type: '/problems/intake-token' });
    }
    const basic = await request(app)
      .post('/v1/signals')
      .set('Authorization', `Basic ${Buffer.from('a:b').toString('base64')}`)
      .send(burglary());
    expect(basic.status).toBe(401);
    expect(await count()).toBe(before);
  });

  it('refuses another account’s token with 403, storing nothing', async () => {
    const body = burglary();
    const response = await post(body, other.token);
    expect(response.status).toBe(403);
    expect(response.headers['content-type']).toContain('application/problem+json');
    expect(response.body.detail).toContain(own.account);
    expect(
      await db('signals')
        .where({ account: own.account, sequence: String(body.sequence).padStart(4, '0') })
        .first(),
    ).toBeUndefined();
  });

  it('answers malformed JSON and bad data with 400 problem+json naming the field', async () => {
    const malformed = await request(app)
      .post('/v1/signals')
      .set('Authorization', `Bearer ${own.token}`)
      .set('Content-Type', 'application/json')
      .send('{"account": "');
    expect(malformed.status).toBe(400);
    expect(malformed.headers['content-type']).toContain('application/problem+json');
    expect(malformed.body).toMatchObject({ type: '/problems/malformed-body', status: 400 });

    const cases: [unknown, string][] = [
      [{ ...burglary(), data: 'hello' }, 'body.data'],
      [{ ...burglary(), data: `#FFFF|1130 01 003` }, 'body.data'],
      [{ ...burglary(), format: 'CSV' }, 'body.format'],
      [{ ...burglary(), sequence: 10_000 }, 'body.sequence'],
      [{ ...burglary(), account: 'XYZ' }, 'body.account'],
      [{ ...burglary(), timestamp: 'yesterday' }, 'body.timestamp'],
      [{ ...burglary(), extra: 1 }, 'body'],
    ];
    for (const [body, field] of cases) {
      const response = await post(body);
      expect(response.status, JSON.stringify(body)).toBe(400);
      expect(response.headers['content-type']).toContain('application/problem+json');
      expect(
        response.body.errors.map((error: { path: string }) => error.path),
        JSON.stringify(body),
      ).toContain(field);
    }
  });

  it('checks the token before reading the body', async () => {
    const response = await request(app)
      .post('/v1/signals')
      .set('Content-Type', 'application/json')
      .send('{not json');
    expect(response.status).toBe(401);
  });

  it('answers other paths with a 404 problem', async () => {
    const response = await request(app).get('/v1/anything');
    expect(response.status).toBe(404);
    expect(response.headers['content-type']).toContain('application/problem+json');
  });
});

describe('the HTTPS listener', () => {
  let folder: string;
  beforeAll(async () => {
    folder = await mkdtemp(path.join(os.tmpdir(), 'wardbook-intake-'));
  });
  afterAll(() => rm(folder, { recursive: true, force: true }));

  function postOverTls(port: number, options: { ca?: string }, body: unknown) {
    const payload = JSON.stringify(body);
    return new Promise<{ status: number; body: Record<string, unknown> }>((resolve, reject) => {
      const outgoing = httpsRequest(
        {
          host: '127.0.0.1',
          port,
          path: '/v1/signals',
          method: 'POST',
          ca: options.ca,
          headers: {
            authorization: `Bearer ${own.token}`,
            'content-type': 'application/json',
            'content-length': Buffer.byteLength(payload),
          },
        },
        (response) => {
          let text = '';
          response.on('data', (chunk: Buffer) => (text += chunk.toString()));
          response.on('end', () =>
            resolve({
              status: response.statusCode!,
              body: JSON.parse(text) as Record<string, unknown>,
            }),
          );
        },
      );
      outgoing.on('error', reject);
      outgoing.end(payload);
    });
  }

  it('makes its certificate once, keeps the key private, and serves signals over TLS', async () => {
    const tls = await loadOrCreateIntakeTls(folder);
    expect(tls.certPath).toBe(path.join(folder, 'intake-tls', 'cert.pem'));
    expect(statSync(path.join(folder, 'intake-tls', 'key.pem')).mode & 0o077).toBe(0);
    expect((await loadOrCreateIntakeTls(folder)).cert).toBe(tls.cert);

    const server = createIntakeServer(app, tls);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      const port = (server.address() as AddressInfo).port;
      const reply = await postOverTls(port, { ca: tls.cert }, burglary(8));
      expect(reply.status).toBe(201);
      expect(await db('signals').where({ id: reply.body.signalId }).first()).toMatchObject({
        transport: 'https',
        zone_or_user: 8,
      });
      // Without trusting that certificate, a client refuses the connection.
      await expect(postOverTls(port, {}, burglary(8))).rejects.toThrow(/self[- ]signed/i);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });

  it('makes a new certificate when the one kept is close to expiring', async () => {
    const kept = await loadOrCreateIntakeTls(folder);
    const later = new Date(Date.now() + 820 * 24 * 60 * 60 * 1000);
    const renewed = await loadOrCreateIntakeTls(folder, later);
    expect(renewed.cert).not.toBe(kept.cert);
    const made = await generateIntakeCertificate();
    expect(made.cert).toContain('BEGIN CERTIFICATE');
  });
});
