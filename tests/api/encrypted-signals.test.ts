import { connect, type AddressInfo, type Server } from 'node:net';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/http/logger';
import { buildFrame, parseFrame, wrapBody } from '../../server/monitoring/protocol/dc09';
import {
  buildEncryptedFrame,
  decryptFrame,
} from '../../server/monitoring/protocol/dc09-encryption';
import { createSignalReceiver } from '../../server/monitoring/receiver';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { createSiteRecord } from '../setup/site-fixtures';

/**
 * Encrypted SIA DC-09 through the real TCP receiver, with a key per account. The encryption
 * itself is checked against pysiaalarm's and NIST's vectors in tests/unit/dc09-encryption.test.ts.
 */
const db = testDb();
let server: Server;
let port: number;
/** A site with an AES-128 key, one with AES-256, and one with none. */
const keyed = { account: '', siteId: '', key: '00112233445566778899AABBCCDDEEFF' };
const keyed256 = { account: '', key: 'A1'.repeat(32) };
const plain = { account: '' };

async function monitoredSite(dc09Key: string | null) {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const { siteId } = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre.id,
  });
  const [site] = await db('sites')
    .where({ id: siteId })
    .update({ dc09_key: dc09Key })
    .returning<{ monitoring_account: string }[]>('monitoring_account');
  return { siteId, account: site!.monitoring_account };
}

beforeAll(async () => {
  Object.assign(keyed, await monitoredSite(keyed.key));
  keyed256.account = (await monitoredSite(keyed256.key)).account;
  plain.account = (await monitoredSite(null)).account;
  server = createSignalReceiver({
    db,
    logger: createLogger('silent', 'test'),
    idleTimeoutMs: 2_000,
    frameTimeoutMs: 1_000,
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  port = (server.address() as AddressInfo).port;
});

afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await closeTestDb();
});

/** Sends text over one connection and collects `replies` frames (CR-terminated). */
function exchange(text: string, replies = 1): Promise<string[]> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    let received = '';
    const timer = setTimeout(() => {
      socket.destroy();
      reject(new Error(`no reply in time; got ${JSON.stringify(received)}`));
    }, 10_000);
    socket.setEncoding('latin1');
    socket.on('data', (chunk: string) => {
      received += chunk;
      const frames = received.split('\r').filter((part) => part.includes('\n'));
      if (frames.length >= replies) {
        clearTimeout(timer);
        socket.end();
        resolve(frames.map((frame) => `${frame.slice(frame.indexOf('\n'))}\r`));
      }
    });
    socket.on('error', reject);
    socket.write(text, 'latin1');
  });
}

let sequence = 100;
const nextSequence = () => String(sequence++).padStart(4, '0');

function encryptedBurglary(
  site: { account: string; key: string },
  options: { sequence?: string; zone?: number; at?: Date; key?: string } = {},
) {
  return buildEncryptedFrame(
    {
      id: 'ADM-CID',
      sequence: options.sequence ?? nextSequence(),
      receiver: '1',
      linePrefix: '232',
      account: site.account,
      data: `#${site.account}|1130 01 ${String(options.zone ?? 3).padStart(3, '0')}`,
      timestamp: options.at ?? new Date(),
    },
    options.key ?? site.key,
  );
}

const idOf = (reply: string) => {
  const parsed = parseFrame(reply);
  return parsed.ok ? `${parsed.frame.encrypted ? '*' : ''}${parsed.frame.id}` : 'unreadable';
};

describe('encrypted DC-09 frames', () => {
  it('records an encrypted burglary once, marked encrypted, and answers with an encrypted ACK', async () => {
    const frame = encryptedBurglary(keyed, { zone: 5 });
    const [reply] = await exchange(frame);
    expect(idOf(reply!)).toBe('*ACK');
    const parsedReply = parseFrame(reply!);
    if (!parsedReply.ok) throw new Error(parsedReply.detail);
    const ack = decryptFrame(parsedReply.frame, keyed.key);
    expect(ack).toMatchObject({ ok: true, frame: { id: 'ACK', account: keyed.account, data: '' } });
    const stored = await db('signals').where({ raw: frame });
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({
      site_id: keyed.siteId,
      was_encrypted: true,
      data: '|1130 01 005',
      category: 'burglary',
      zone_or_user: 5,
      event_code: '130',
    });
    expect(stored[0].event_id).not.toBeNull();
  });

  it('stores a resend once, whether the same bytes or encrypted afresh with a new pad', async () => {
    const resent = nextSequence();
    const first = encryptedBurglary(keyed, { sequence: resent, zone: 6 });
    const again = encryptedBurglary(keyed, { sequence: resent, zone: 6 });
    expect(again).not.toBe(first);
    const replies = await exchange(first + first + again, 3);
    expect(replies.map(idOf)).toEqual(['*ACK', '*ACK', '*ACK']);
    const stored = await db('signals').where({ account: keyed.account, sequence: resent });
    expect(stored).toHaveLength(1);
  });

  it('takes AES-256 keys as well', async () => {
    const frame = encryptedBurglary(keyed256);
    const [reply] = await exchange(frame);
    expect(idOf(reply!)).toBe('*ACK');
    expect(await db('signals').where({ raw: frame }).first()).toMatchObject({
      was_encrypted: true,
    });
  });

  it('answers an encrypted link test with an encrypted ACK and stores nothing', async () => {
    const link = buildEncryptedFrame(
      {
        id: 'NULL',
        sequence: nextSequence(),
        receiver: '1',
        linePrefix: '232',
        account: keyed.account,
        data: '',
        timestamp: new Date(),
      },
      keyed.key,
    );
    const [reply] = await exchange(link);
    expect(idOf(reply!)).toBe('*ACK');
    expect(await db('signals').where({ raw: link }).first()).toBeUndefined();
  });

  it('refuses a frame encrypted with the wrong key: DUH, nothing stored', async () => {
    const frame = encryptedBurglary(keyed, { key: 'FFEEDDCCBBAA99887766554433221100' });
    const [reply] = await exchange(frame);
    expect(idOf(reply!)).toBe('DUH');
    expect(parseFrame(reply!)).toMatchObject({ ok: true, frame: { account: keyed.account } });
    expect(await db('signals').where({ raw: frame }).first()).toBeUndefined();
  });

  it('refuses an encrypted frame from an account with no key: DUH, nothing stored', async () => {
    const frame = encryptedBurglary({ account: plain.account, key: keyed.key });
    const [reply] = await exchange(frame);
    expect(idOf(reply!)).toBe('DUH');
    expect(await db('signals').where({ raw: frame }).first()).toBeUndefined();
  });

  it('refuses a plain frame from an account that has a key: DUH, nothing stored', async () => {
    const frame = buildFrame({
      id: 'ADM-CID',
      encrypted: false,
      sequence: nextSequence(),
      receiver: '1',
      linePrefix: '232',
      account: keyed.account,
      data: `#${keyed.account}|1130 01 003`,
      timestamp: new Date(),
    });
    const [reply] = await exchange(frame);
    expect(idOf(reply!)).toBe('DUH');
    expect(await db('signals').where({ raw: frame }).first()).toBeUndefined();
  });

  it('refuses an encrypted frame whose clock is out of the window with NAK and the time', async () => {
    const frame = encryptedBurglary(keyed, { at: new Date(Date.now() - 5 * 60_000) });
    const [reply] = await exchange(frame);
    expect(reply).toContain('"NAK"0000R0L0A0[]_');
    expect(await db('signals').where({ raw: frame }).first()).toBeUndefined();
  });

  it('answers every one of 300 random encrypted frames, and still takes a good one after', async () => {
    // Random ciphertext with a correct CRC and length reaches the decryption: each must get
    // its one reply (a refusal), so none crashed the receiver or left it waiting.
    const frames = fc
      .sample(
        fc.oneof(
          fc
            .uint8Array({ minLength: 1, maxLength: 200 })
            .map((bytes) => Buffer.from(bytes).toString('hex').toUpperCase()),
          fc.string({ unit: fc.constantFrom(...'0123456789ABCDEF'), maxLength: 300 }),
        ),
        { numRuns: 300, seed: 20261206 },
      )
      .map((ciphertext) =>
        wrapBody(`"*ADM-CID"${nextSequence().slice(-4)}R1L232#${keyed.account}[${ciphertext}`),
      );
    const replies = await exchange(frames.join(''), frames.length);
    expect(replies).toHaveLength(frames.length);
    expect(new Set(replies.map(idOf))).toEqual(new Set(['DUH']));
    // Raw bytes after the `*`, framing characters included: whatever they do, the receiver
    // carries on.
    const bytes = fc.sample(fc.uint8Array({ maxLength: 300 }), { numRuns: 100, seed: 6 });
    const socket = connect(port, '127.0.0.1');
    await new Promise((resolve) => socket.on('connect', resolve));
    socket.on('error', () => undefined);
    for (const sample of bytes)
      socket.write(
        Buffer.concat([Buffer.from(`\n0000004C"*SIA-DCS"0001L0#${keyed.account}[`), sample]),
      );
    socket.destroy();
    const [reply] = await exchange(encryptedBurglary(keyed, { zone: 9 }));
    expect(idOf(reply!)).toBe('*ACK');
  });
});
