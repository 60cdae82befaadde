import { createServer, type Server, type Socket } from 'node:net';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { parseAdmCidData, parseSiaDcsData } from './protocol/contact-id';
import { ackFor, duhFor, MAX_FRAME_CHARS, nak, parseFrame, type Dc09Frame } from './protocol/dc09';
import { recordSignal, type IncomingSignal } from './repository';

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
  const common = {
    transport: 'dc09_tcp' as const,
    protocol: frame.id,
    account: frame.account,
    sequence: frame.sequence,
    receiver: frame.receiver,
    linePrefix: frame.linePrefix,
    data: frame.data,
    wasEncrypted: frame.encrypted,
    panelTime: frame.timestamp,
    raw,
  };
  if (frame.id === 'ADM-CID') {
    const event = parseAdmCidData(frame.data);
    if (!event) return undefined;
    return {
      ...common,
      eventCode: event.code,
      category: event.category,
      qualifier: event.qualifier,
      zoneOrUser: event.zoneOrUser,
      partition: event.partition,
    };
  }
  if (frame.id === 'SIA-DCS') {
    const event = parseSiaDcsData(frame.data);
    if (!event) return undefined;
    return {
      ...common,
      eventCode: event.code,
      category: event.category,
      qualifier: event.qualifier,
      zoneOrUser: event.zoneOrUser,
      partition: event.area,
    };
  }
  return undefined;
}

/** Decides the reply to one frame; a signal is committed before its ACK is returned. */
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
  const { frame } = parsed;
  if (frame.timestamp) {
    const skew = frame.timestamp.getTime() - now.getTime();
    if (skew > CLOCK_AHEAD_MS || skew < -CLOCK_BEHIND_MS)
      return { reply: nak(now), outcome: 'nak:clock' };
  }
  if (frame.id === 'NULL') return { reply: ackFor(frame), outcome: 'ack:link-test' };
  // Encrypted frames need the account's key; until one is configured they are not understood.
  if (frame.encrypted) return { reply: duhFor(frame), outcome: 'duh:encrypted' };
  const signal = toIncoming(frame, raw);
  if (!signal) return { reply: duhFor(frame), outcome: `duh:${frame.id}` };
  const stored = await recordSignal(options.db, signal);
  return {
    reply: ackFor(frame),
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
