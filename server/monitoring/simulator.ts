import { connect } from 'node:net';
import { contactIdChecksum } from './protocol/contact-id';
import { buildFrame, parseFrame } from './protocol/dc09';

export interface SimulatedSignal {
  format: 'adm-cid' | 'sia-dcs' | 'null';
  account: string;
  /** Contact ID event code (e.g. 130) or SIA-DCS two-letter code (e.g. BA). */
  code: string;
  zone: number;
  partition: number;
  qualifier: 'new' | 'restore';
  sequence: number;
  receiver: string;
  linePrefix: string;
}

const QUALIFIER_DIGIT = { new: '1', restore: '3' } as const;

/** The DC-09 frame a panel would send for this event. */
export function simulatedFrame(signal: SimulatedSignal, now = new Date()): string {
  const pad = (value: number, width: number) => String(value).padStart(width, '0');
  const data =
    signal.format === 'adm-cid'
      ? `#${signal.account}|${QUALIFIER_DIGIT[signal.qualifier]}${signal.code} ${pad(signal.partition, 2)} ${pad(signal.zone, 3)}`
      : signal.format === 'sia-dcs'
        ? `#${signal.account}|Nri${signal.partition}/${signal.code}${pad(signal.zone, 2)}`
        : '';
  return buildFrame({
    id: signal.format === 'adm-cid' ? 'ADM-CID' : signal.format === 'sia-dcs' ? 'SIA-DCS' : 'NULL',
    encrypted: false,
    sequence: pad(signal.sequence % 10_000, 4),
    receiver: signal.receiver,
    linePrefix: signal.linePrefix,
    account: signal.account,
    data,
    timestamp: now,
  });
}

/** The 16-digit Contact ID message the same event would be over a telephone line, with S. */
export function contactIdMessage(signal: SimulatedSignal): string {
  const digits = `${signal.account.padStart(4, '0').slice(-4)}18${QUALIFIER_DIGIT[signal.qualifier]}${signal.code}${String(signal.partition).padStart(2, '0')}${String(signal.zone).padStart(3, '0')}`;
  return `${digits}${contactIdChecksum(digits)}`;
}

/** Sends one frame and resolves with the receiver's reply (the frame up to its CR). */
export function sendFrame(
  frame: string,
  options: { host: string; port: number; timeoutMs?: number },
): Promise<string> {
  return new Promise((resolve, reject) => {
    const socket = connect(options.port, options.host);
    let received = '';
    const timer = setTimeout(() => {
      socket.destroy();
      reject(new Error(`no reply from ${options.host}:${options.port}`));
    }, options.timeoutMs ?? 10_000);
    socket.setEncoding('latin1');
    socket.on('data', (chunk: string) => {
      received += chunk;
      const end = received.indexOf('\r');
      if (end !== -1) {
        clearTimeout(timer);
        socket.end();
        resolve(received.slice(0, end + 1));
      }
    });
    socket.on('error', (error) => {
      clearTimeout(timer);
      reject(error);
    });
    socket.write(frame, 'latin1');
  });
}

export function describeReply(reply: string): string {
  const parsed = parseFrame(reply);
  if (!parsed.ok) return `unreadable reply (${parsed.problem}): ${JSON.stringify(reply)}`;
  return `${parsed.frame.id} for sequence ${parsed.frame.sequence}, account ${parsed.frame.account}`;
}
