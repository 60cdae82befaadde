import { connect, type AddressInfo, type Server } from 'node:net';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/http/logger';
import { buildFrame, parseFrame, wrapBody } from '../../server/monitoring/protocol/dc09';
import { createSignalReceiver } from '../../server/monitoring/receiver';
import { isValidContactIdMessage } from '../../server/monitoring/protocol/contact-id';
import {
  contactIdMessage,
  describeReply,
  sendFrame,
  simulatedFrame,
} from '../../server/monitoring/simulator';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { createSiteRecord } from '../setup/site-fixtures';

const db = testDb();
let server: Server;
let port: number;
let account: string;
let siteId: string;

beforeAll(async () => {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const site = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre.id,
  });
  siteId = site.siteId;
  account = (await db('sites').where({ id: siteId }).first()).monitoring_account;
  server = createSignalReceiver({
    db,
    logger: createLogger('silent', 'test'),
    idleTimeoutMs: 1_500,
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
function exchange(text: string | Buffer, replies = 1): Promise<string[]> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    let received = '';
    const timer = setTimeout(() => {
      socket.destroy();
      reject(new Error(`no reply in time; got ${JSON.stringify(received)}`));
    }, 5_000);
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
    socket.write(text);
  });
}

let sequence = 1;
const nextSequence = () => String(sequence++).padStart(4, '0');

function burglary(options: { account?: string; sequence?: string; zone?: number; at?: Date } = {}) {
  return buildFrame({
    id: 'ADM-CID',
    encrypted: false,
    sequence: options.sequence ?? nextSequence(),
    receiver: '1',
    linePrefix: '232',
    account: options.account ?? account,
    data: `#${options.account ?? account}|1130 01 ${String(options.zone ?? 3).padStart(3, '0')}`,
    timestamp: options.at ?? new Date(),
  });
}

const replyId = (reply: string) => {
  const parsed = parseFrame(reply);
  return parsed.ok ? parsed.frame.id : reply.slice(9, 14);
};

describe('the DC-09 receiver', () => {
  it('acknowledges a burglary only once it is stored, and places it on its site', async () => {
    const frame = burglary({ zone: 5 });
    const [reply] = await exchange(frame);
    const parsed = parseFrame(reply!);
    expect(parsed).toMatchObject({ ok: true, frame: { id: 'ACK', account, data: '' } });
    const stored = await db('signals').where({ raw: frame }).first();
    expect(stored).toMatchObject({
      site_id: siteId,
      unknown_account: false,
      protocol: 'ADM-CID',
      event_code: '130',
      category: 'burglary',
      qualifier: 'new',
      zone_or_user: 5,
    });
  });

  it('stores a resent frame once and acknowledges both', async () => {
    const frame = burglary({ zone: 6 });
    const replies = await exchange(frame + frame, 2);
    expect(replies.map(replyId)).toEqual(['ACK', 'ACK']);
    expect(await db('signals').where({ raw: frame }).count('* as n')).toEqual([{ n: 1 }]);
  });

  it('records and flags a signal from an account no site holds', async () => {
    const frame = burglary({ account: 'FEDCBA98' });
    const [reply] = await exchange(frame);
    expect(replyId(reply!)).toBe('ACK');
    expect(await db('signals').where({ raw: frame }).first()).toMatchObject({
      site_id: null,
      unknown_account: true,
    });
  });

  it('answers a link test without storing it, and SIA-DCS as well as Contact ID', async () => {
    const link = buildFrame({
      id: 'NULL',
      encrypted: false,
      sequence: nextSequence(),
      receiver: '1',
      linePrefix: '232',
      account,
      data: '',
      timestamp: new Date(),
    });
    const [linkReply] = await exchange(link);
    expect(replyId(linkReply!)).toBe('ACK');
    expect(await db('signals').where({ raw: link }).first()).toBeUndefined();
    const fire = buildFrame({
      id: 'SIA-DCS',
      encrypted: false,
      sequence: nextSequence(),
      receiver: '1',
      linePrefix: '232',
      account,
      data: `#${account}|NFA012`,
      timestamp: new Date(),
    });
    await exchange(fire);
    expect(await db('signals').where({ raw: fire }).first()).toMatchObject({
      category: 'fire',
      zone_or_user: 12,
    });
  });

  it('refuses a bad CRC or length with NAK, and stores nothing', async () => {
    const frame = burglary();
    const badCrc = `\n0000${frame.slice(5)}`;
    const [crcReply] = await exchange(badCrc);
    expect(crcReply).toContain('"NAK"0000R0L0A0[]_');
    const badLength = frame.replace(/^(\n.{4})0(...)/, '$10FFF');
    const [lengthReply] = await exchange(badLength);
    expect(lengthReply).toContain('"NAK"');
    expect(await db('signals').where({ raw: badCrc }).first()).toBeUndefined();
  });

  it('refuses a frame whose clock is out of the window, giving the receiver’s time', async () => {
    const frame = burglary({ at: new Date(Date.now() - 5 * 60_000) });
    const [reply] = await exchange(frame);
    expect(reply).toContain('"NAK"');
    expect(await db('signals').where({ raw: frame }).first()).toBeUndefined();
  });

  it('answers DUH to a frame it cannot understand', async () => {
    const frame = wrapBody(`"ADM-CID"${nextSequence()}R1L232#${account}[#${account}|9999]`);
    const [reply] = await exchange(frame);
    expect(replyId(reply!)).toBe('DUH');
  });

  it('refuses an endless frame and closes the connection', async () => {
    const [reply] = await exchange(`\n${'A'.repeat(3000)}`);
    expect(reply).toContain('"NAK"');
  });

  it('drops an idle connection and a trickling one', async () => {
    const closedAfter = (write: (socket: ReturnType<typeof connect>) => void) =>
      new Promise<number>((resolve) => {
        const started = Date.now();
        const socket = connect(port, '127.0.0.1', () => write(socket));
        socket.on('close', () => resolve(Date.now() - started));
        socket.on('error', () => undefined);
      });
    // Closed by the receiver, not by this test: the promises resolve only on close.
    await closedAfter(() => undefined);
    await closedAfter((socket) => {
      const partial = burglary();
      let index = 0;
      const trickle = setInterval(() => {
        if (socket.destroyed || index >= partial.length - 1) return clearInterval(trickle);
        socket.write(partial[index++]!);
      }, 200);
    });
  });

  it('survives 300 random and mangled inputs and still acknowledges a good frame', async () => {
    const samples = fc.sample(
      fc.oneof(
        fc.string({ maxLength: 400 }).map((text) => `\n${text}\r`),
        fc.uint8Array({ maxLength: 400 }).map((bytes) => Buffer.from(bytes)),
        fc.tuple(fc.nat({ max: 60 }), fc.integer({ min: 0x20, max: 0x7e })).map(([index, code]) => {
          const frame = burglary();
          return frame.slice(0, index + 1) + String.fromCharCode(code) + frame.slice(index + 2);
        }),
      ),
      { numRuns: 300, seed: 20261202 },
    );
    const socket = connect(port, '127.0.0.1');
    await new Promise((resolve) => socket.on('connect', resolve));
    socket.on('error', () => undefined);
    for (const sample of samples) socket.write(sample);
    socket.destroy();
    const [reply] = await exchange(burglary({ zone: 9 }));
    expect(replyId(reply!)).toBe('ACK');
  });

  it('takes what the panel simulator sends, as Contact ID and as SIA-DCS', async () => {
    for (const format of ['adm-cid', 'sia-dcs'] as const) {
      const signal = {
        format,
        account,
        code: format === 'adm-cid' ? '130' : 'BA',
        zone: 4,
        partition: 1,
        qualifier: 'new' as const,
        sequence: 7000 + sequence++,
        receiver: '1',
        linePrefix: '1',
      };
      const frame = simulatedFrame(signal);
      const reply = await sendFrame(frame, { host: '127.0.0.1', port });
      expect(describeReply(reply)).toMatch(/^ACK for sequence/);
      expect(await db('signals').where({ raw: frame }).first()).toMatchObject({
        category: 'burglary',
        zone_or_user: 4,
      });
    }
    const line = contactIdMessage({
      format: 'adm-cid',
      account: '1234',
      code: '131',
      zone: 15,
      partition: 1,
      qualifier: 'new',
      sequence: 1,
      receiver: '1',
      linePrefix: '1',
    });
    // The worked example of spandsp's ademco_contactid.c: 1234 18 1 131 01 015, S = 8.
    expect(line).toBe('1234181131010158');
    expect(isValidContactIdMessage(line)).toBe(true);
  });
});
