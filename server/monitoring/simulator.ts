import { request } from 'node:https';
import { connect } from 'node:net';
import { contactIdChecksum } from './protocol/contact-id';
import { buildFrame, parseFrame } from './protocol/dc09';
import { buildEncryptedFrame, decryptFrame } from './protocol/dc09-encryption';

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

/** The event as DC-09 data: `#acct|Q XYZ GG CCC` (Contact ID) or `#acct|Nri…/CCzz` (SIA). */
export function simulatedData(signal: SimulatedSignal): string {
  const pad = (value: number, width: number) => String(value).padStart(width, '0');
  if (signal.format === 'adm-cid')
    return `#${signal.account}|${QUALIFIER_DIGIT[signal.qualifier]}${signal.code} ${pad(signal.partition, 2)} ${pad(signal.zone, 3)}`;
  if (signal.format === 'sia-dcs')
    return `#${signal.account}|Nri${signal.partition}/${signal.code}${pad(signal.zone, 2)}`;
  return '';
}

/**
 * The DC-09 frame a panel would send for this event; with the account's key (hex), the
 * encrypted form.
 */
export function simulatedFrame(signal: SimulatedSignal, now = new Date(), key?: string): string {
  const pad = (value: number, width: number) => String(value).padStart(width, '0');
  const data = simulatedData(signal);
  const frame = {
    id: signal.format === 'adm-cid' ? 'ADM-CID' : signal.format === 'sia-dcs' ? 'SIA-DCS' : 'NULL',
    sequence: pad(signal.sequence % 10_000, 4),
    receiver: signal.receiver,
    linePrefix: signal.linePrefix,
    account: signal.account,
    data,
    timestamp: now,
  };
  return key ? buildEncryptedFrame(frame, key) : buildFrame({ ...frame, encrypted: false });
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

/** The reply in words; an encrypted reply is decrypted with the key the frame was sent with. */
export function describeReply(reply: string, key?: string): string {
  const parsed = parseFrame(reply);
  if (!parsed.ok) return `unreadable reply (${parsed.problem}): ${JSON.stringify(reply)}`;
  const { frame } = parsed;
  const about = `for sequence ${frame.sequence}, account ${frame.account}`;
  if (!frame.encrypted) return `${frame.id} ${about}`;
  if (!key) return `${frame.id} ${about} (encrypted; give --key to read it)`;
  const decrypted = decryptFrame(frame, key);
  if (!decrypted.ok)
    return `${frame.id} ${about} (encrypted, but not readable: ${decrypted.detail})`;
  return `${frame.id} ${about} (encrypted; receiver time ${decrypted.frame.timestamp!.toISOString()})`;
}

/**
 * Posts the event to the HTTPS intake as an IP communicator would, trusting the intake's own
 * certificate (`ca`); resolves with the status and the parsed reply.
 */
export function postToIntake(
  signal: SimulatedSignal,
  options: { host: string; port: number; token: string; ca: string; timeoutMs?: number },
  now = new Date(),
): Promise<{ status: number; body: unknown }> {
  if (signal.format === 'null') return Promise.reject(new Error('the intake takes no link tests'));
  const payload = JSON.stringify({
    account: signal.account,
    sequence: signal.sequence % 10_000,
    format: signal.format === 'adm-cid' ? 'ADM-CID' : 'SIA-DCS',
    data: simulatedData(signal),
    timestamp: now.toISOString(),
  });
  return new Promise((resolve, reject) => {
    const outgoing = request(
      {
        host: options.host,
        port: options.port,
        path: '/v1/signals',
        method: 'POST',
        ca: options.ca,
        timeout: options.timeoutMs ?? 10_000,
        headers: {
          authorization: `Bearer ${options.token}`,
          'content-type': 'application/json',
          'content-length': Buffer.byteLength(payload),
        },
      },
      (response) => {
        let text = '';
        response.setEncoding('utf8');
        response.on('data', (chunk: string) => (text += chunk));
        response.on('end', () => {
          let body: unknown = text;
          try {
            body = JSON.parse(text);
          } catch {
            // Not JSON: shown as it came.
          }
          resolve({ status: response.statusCode ?? 0, body });
        });
      },
    );
    outgoing.on('timeout', () => outgoing.destroy(new Error('no reply from the intake in time')));
    outgoing.on('error', reject);
    outgoing.end(payload);
  });
}
