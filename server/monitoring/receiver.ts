import { createServer, type Server, type Socket } from 'node:net';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { dc09KeyForAccount } from './credentials/repository';
import { ackFor, duhFor, MAX_FRAME_CHARS, nak, parseFrame, type Dc09Frame } from './protocol/dc09';
import { decryptFrame, encryptedAckFor } from './protocol/dc09-encryption';
import { recordSignal, type IncomingSignal } from './repository';
import { readSignalContent } from './signal-content';

export interface ReceiverOptions {
  db: Knex;
  logger: Logger;
  /** A connection with nothing arriving for this long is closed. */
  idleTimeoutMs?: number;
  /** A frame begun but not finished within this long is abandoned (a trickling sender). */
  frameTimeoutMs?: number;
  /** The clock, for tests. */
  now?: () => Date;
}

/**
 * How far a panel's clock may be from the receiver's: DC-09 receivers refuse a frame more than
 * 20 s ahead or 40 s behind (SIA DC-09:2013, from memory), answering NAK with their own time so
 * the panel can correct its clock.
 */
export const CLOCK_AHEAD_MS = 20_000;
export const CLOCK_BEHIND_MS = 40_000;

type Reply = { reply: string; outcome: string };

function toIncoming(frame: Dc09Frame, raw: string): IncomingSignal | undefined {
  const content = readSignalContent(frame.id, frame.data);
  if (!content) return undefined;
  return {
    transport: 'dc09_tcp',
    protocol: frame.id,
    account: frame.account,
    sequence: frame.sequence,
    receiver: frame.receiver,
    linePrefix: frame.linePrefix,
    data: frame.data,
    wasEncrypted: frame.encrypted,
    panelTime: frame.timestamp,
    raw,
    eventCode: content.eventCode,
    category: content.category,
    qualifier: content.qualifier,
    zoneOrUser: content.zoneOrUser,
    partition: content.partition,
  };
}

/**
 * Decides the reply to one frame; a signal is committed before its ACK is returned.
 *
 * Encryption is per account. An encrypted frame is decrypted with the account's key and then
 * checked like any plain frame; its ACK is encrypted too. When the account has no key, or the
 * frame does not decrypt to a DC-09 message with its timestamp, the answer is DUH, not NAK:
 * SIA DC-09 keeps NAK for frames refused in transit (CRC, length, clock; from memory), and NAK
 * carries the receiver's time so the panel corrects its clock and resends, which cannot help when
 * the key is missing or wrong. (pysiaalarm answers NAK here, src/pysiaalarm/base_server.py; a
 * panel stops resending on either, and DUH tells the installer what is wrong.) NAK and DUH go in
 * clear, as pysiaalarm sends them: without a shared key there is nothing to encrypt them with.
 *
 * An account that has a key but sends a plain frame gets DUH too, and nothing is stored: a
 * configured key is the centre's statement that this panel encrypts, so a plain frame is either a
 * misconfigured panel or someone else using the account number, and accepting it would let
 * anyone bypass the encryption by leaving it off (sensible practice; DC-09 leaves it to the
 * receiver).
 */
export async function handleFrame(
  options: Pick<ReceiverOptions, 'db' | 'now'>,
  raw: string,
): Promise<Reply> {
  const now = options.now?.() ?? new Date();
  const parsed = parseFrame(raw);
  if (!parsed.ok) {
    if (parsed.problem === 'format' && parsed.header)
      return { reply: duhFor(parsed.header), outcome: `duh:${parsed.problem}` };
    return { reply: nak(now), outcome: `nak:${parsed.problem}` };
  }
  const key = await dc09KeyForAccount(options.db, parsed.frame.account);
  let frame = parsed.frame;
  if (frame.encrypted) {
    if (!key) return { reply: duhFor(frame), outcome: 'duh:no-key' };
    const decrypted = decryptFrame(frame, key);
    if (!decrypted.ok) return { reply: duhFor(frame), outcome: 'duh:undecryptable' };
    frame = decrypted.frame;
  } else if (key) {
    return { reply: duhFor(frame), outcome: 'duh:plain-from-keyed-account' };
  }
  if (frame.timestamp) {
    const skew = frame.timestamp.getTime() - now.getTime();
    if (skew > CLOCK_AHEAD_MS || skew < -CLOCK_BEHIND_MS)
      return { reply: nak(now), outcome: 'nak:clock' };
  }
  const ack = () => (frame.encrypted ? encryptedAckFor(frame, key!, now) : ackFor(frame));
  if (frame.id === 'NULL') return { reply: ack(), outcome: 'ack:link-test' };
  const signal = toIncoming(frame, raw);
  if (!signal) return { reply: duhFor(frame), outcome: `duh:${frame.id}` };
  const stored = await recordSignal(options.db, signal);
  return {
    reply: ack(),
    outcome: stored.duplicate ? 'ack:duplicate' : stored.siteId ? 'ack:stored' : 'ack:unknown',
  };
}

/**
 * The DC-09 receiver: one TCP listener, frames read between LF and CR, each answered in order.
 * A store failure sends no ACK (the panel will resend), so an acknowledged signal is never lost.
 */
export function createSignalReceiver(options: ReceiverOptions): Server {
  const idleTimeoutMs = options.idleTimeoutMs ?? 60_000;
  const frameTimeoutMs = options.frameTimeoutMs ?? 10_000;
  return createServer((socket: Socket) => {
    socket.setEncoding('latin1');
    socket.setTimeout(idleTimeoutMs);
    socket.on('timeout', () => socket.destroy());
    socket.on('error', () => socket.destroy());
    let buffer = '';
    let frameStarted: NodeJS.Timeout | null = null;
    let queue: Promise<void> = Promise.resolve();

    const answer = (raw: string) => {
      queue = queue.then(async () => {
        try {
          const { reply, outcome } = await handleFrame(options, raw);
          options.logger.debug({ outcome }, 'frame answered');
          if (!socket.destroyed) socket.write(reply, 'latin1');
        } catch (error) {
          // Not stored, so not acknowledged: the panel resends and nothing is lost.
          options.logger.error({ err: error }, 'signal not stored; no ACK sent');
        }
      });
    };

    socket.on('data', (chunk: string) => {
      buffer += chunk;
      for (;;) {
        const start = buffer.indexOf('\n');
        if (start === -1) {
          buffer = '';
          break;
        }
        const end = buffer.indexOf('\r', start);
        if (end === -1) {
          buffer = buffer.slice(start);
          if (buffer.length > MAX_FRAME_CHARS + 2) {
            // No CR within any frame's length: refuse it and drop the connection.
            answer(buffer.slice(0, MAX_FRAME_CHARS + 2));
            void queue.then(() => socket.end());
            buffer = '';
          } else if (!frameStarted) {
            frameStarted = setTimeout(() => socket.destroy(), frameTimeoutMs);
          }
          break;
        }
        if (frameStarted) {
          clearTimeout(frameStarted);
          frameStarted = null;
        }
        answer(buffer.slice(start, end + 1));
        buffer = buffer.slice(end + 1);
      }
    });
    socket.on('close', () => {
      if (frameStarted) clearTimeout(frameStarted);
    });
  });
}
