import { connect } from 'node:net';
import { parseFrame } from '../../server/monitoring/protocol/dc09';
import type { SimulatedSignal } from '../../server/monitoring/simulator';

/**
 * One panel's TCP connection to the receiver, kept open for many frames the way a panel on an
 * IP path keeps its link up. The receiver answers a connection's frames in order, so replies
 * are matched to frames first in, first out.
 */
export interface PanelLink {
  /** Sends a frame; resolves with the receiver's reply to it, rejects if the link drops first. */
  send(frame: string): Promise<string>;
  close(): void;
}

export class LinkDroppedError extends Error {}

export function openPanelLink(port: number, host = '127.0.0.1'): Promise<PanelLink> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, host);
    const waiting: { resolve: (reply: string) => void; reject: (error: Error) => void }[] = [];
    let received = '';
    let dropped: Error | null = null;

    socket.setEncoding('latin1');
    socket.setNoDelay(true);
    socket.on('data', (chunk: string) => {
      received += chunk;
      for (;;) {
        const start = received.indexOf('\n');
        const end = start === -1 ? -1 : received.indexOf('\r', start);
        if (end === -1) break;
        const reply = received.slice(start, end + 1);
        received = received.slice(end + 1);
        waiting.shift()?.resolve(reply);
      }
    });
    const drop = (error?: Error) => {
      dropped ??= new LinkDroppedError(error?.message ?? 'the receiver closed the connection');
      for (const waiter of waiting.splice(0)) waiter.reject(dropped);
    };
    socket.on('close', () => drop());
    socket.on('error', (error) => {
      drop(error);
      reject(error);
    });
    socket.once('connect', () =>
      resolve({
        send(frame) {
          if (dropped) return Promise.reject(dropped);
          return new Promise<string>((resolveReply, rejectReply) => {
            waiting.push({ resolve: resolveReply, reject: rejectReply });
            socket.write(frame, 'latin1');
          });
        },
        close() {
          socket.end();
        },
      }),
    );
  });
}

/** True when the reply is an ACK naming this frame's account and sequence number. */
export function isAckFor(reply: string, signal: Pick<SimulatedSignal, 'account' | 'sequence'>) {
  const parsed = parseFrame(reply);
  return (
    parsed.ok &&
    parsed.frame.id === 'ACK' &&
    parsed.frame.account === signal.account &&
    Number(parsed.frame.sequence) === signal.sequence % 10_000
  );
}

/**
 * A panel's ordinary traffic, by sequence number: intruder alarms and their restores across
 * eight zones, setting and unsetting by users, and periodic tests. Invented, not recorded
 * from any panel; the codes are Contact ID's (SIA DC-05).
 */
export function everydaySignal(account: string, sequence: number): SimulatedSignal {
  const zone = 1 + (Math.floor(sequence / 5) % 8);
  const user = 1 + (sequence % 4);
  const common = { format: 'adm-cid' as const, account, partition: 1, sequence };
  const shapes: Omit<SimulatedSignal, keyof typeof common | 'receiver' | 'linePrefix'>[] = [
    { code: '130', zone, qualifier: 'new' },
    { code: '130', zone, qualifier: 'restore' },
    { code: '401', zone: user, qualifier: 'new' },
    { code: '401', zone: user, qualifier: 'restore' },
    { code: '602', zone: 0, qualifier: 'new' },
  ];
  return { ...common, ...shapes[sequence % shapes.length]!, receiver: '1', linePrefix: '1' };
}
