import { crc16 } from 'crc';

/**
 * SIA DC-09 framing, pure: parse a frame as it arrives over TCP, and build frames and the
 * receiver's replies. A frame is
 *
 *   <LF> CRC 0LLL "ID" seq [Rrcvr] Lpref #acct [data] [extended…] [_HH:MM:SS,MM-DD-YYYY] <CR>
 *
 * where CRC is CRC-16/ARC as four hex digits and LLL the length in hex, both over everything
 * from the opening quote to the end of the timestamp. Nothing here throws on bad input: every
 * problem comes back as a reason, so a hostile or garbled frame cannot stop the receiver.
 *
 * An encrypted frame ("*" before the ID) ends at its `[`, followed by the hex of the AES
 * ciphertext; its data, `]`, extended data and timestamp are inside that ciphertext
 * (dc09-encryption.ts reads them once the account's key is known).
 */

export const LF = '\n';
export const CR = '\r';
/** Longer frames are refused unread; a DC-09 frame's length field stops at 0x3FF anyway. */
export const MAX_FRAME_CHARS = 1100;

export interface Dc09Frame {
  /** "SIA-DCS", "ADM-CID", "NULL" … */
  id: string;
  /** The `*` form: the data and timestamp are AES-encrypted (hex) with the account's key. */
  encrypted: boolean;
  sequence: string;
  receiver: string | null;
  linePrefix: string;
  account: string;
  /** Between the first [ and its ]: for an encrypted frame, the hex ciphertext after the [. */
  data: string;
  /** Extended data blocks such as [X…] and [Y…], without brackets. */
  extended: string[];
  /** The panel's clock, read as UTC, or null when the frame carries none. */
  timestamp: Date | null;
}

export type Dc09Problem = 'too_long' | 'framing' | 'length' | 'crc' | 'format' | 'timestamp';

export type Dc09Parse =
  | { ok: true; frame: Dc09Frame }
  | {
      ok: false;
      problem: Dc09Problem;
      detail: string;
      /** What could be read of the header, for a DUH that names the sequence and account. */
      header: Pick<Dc09Frame, 'sequence' | 'receiver' | 'linePrefix' | 'account'> | null;
    };

const BODY =
  /^"([A-Z0-9-]{3,12})"(\d{4})(?:R([0-9A-F]{1,6}))?L([0-9A-F]{1,6})#([0-9A-F]{3,16})\[([^\]]*)\]((?:\[[^\]]*\])*)(?:_(\d{2}):(\d{2}):(\d{2}),(\d{2})-(\d{2})-(\d{4}))?$/;

/** The encrypted form: the header, `[`, then hex to the end (pysiaalarm's test frames, and
 *  jvanovost/dc09_spt's dc09block, send nothing after the ciphertext). */
const ENCRYPTED_BODY =
  /^"\*([A-Z0-9-]{3,12})"(\d{4})(?:R([0-9A-F]{1,6}))?L([0-9A-F]{1,6})#([0-9A-F]{3,16})\[([0-9A-Fa-f]*)$/;

const HEADER = /"\*?[A-Z0-9-]{3,12}"(\d{4})(?:R([0-9A-F]{1,6}))?L([0-9A-F]{1,6})#([0-9A-F]{3,16})/;

export const crcOf = (body: string) =>
  crc16(Buffer.from(body, 'latin1')).toString(16).toUpperCase().padStart(4, '0');

function headerOf(body: string) {
  const match = HEADER.exec(body);
  return match
    ? { sequence: match[1]!, receiver: match[2] ?? null, linePrefix: match[3]!, account: match[4]! }
    : null;
}

function fail(problem: Dc09Problem, detail: string, body = ''): Dc09Parse {
  return { ok: false, problem, detail, header: headerOf(body) };
}

/** Parses one frame; `raw` may include the LF before it and the CR after it. */
export function parseFrame(raw: string): Dc09Parse {
  if (raw.length > MAX_FRAME_CHARS) return fail('too_long', `over ${MAX_FRAME_CHARS} characters`);
  const text = raw.replace(/^\n/, '').replace(/\r$/, '');
  if (text.length < 9) return fail('framing', 'too short for a CRC and a length');
  const crc = text.slice(0, 4);
  const lengthField = text.slice(4, 8);
  const body = text.slice(8);
  if (!/^[0-9A-F]{4}$/.test(crc))
    return fail('framing', 'the CRC is not four upper-case hex digits', body);
  if (!/^0[0-9A-F]{3}$/.test(lengthField))
    return fail('framing', 'the length is not 0 and three hex digits', body);
  if (Number.parseInt(lengthField, 16) !== body.length)
    return fail('length', `length says ${lengthField}, body is ${body.length} characters`, body);
  if (crcOf(body) !== crc) return fail('crc', `CRC says ${crc}, body gives ${crcOf(body)}`, body);
  const encrypted = ENCRYPTED_BODY.exec(body);
  if (encrypted) {
    const [, id, sequence, receiver, linePrefix, account, ciphertext] = encrypted;
    return {
      ok: true,
      frame: {
        id: id!,
        encrypted: true,
        sequence: sequence!,
        receiver: receiver ?? null,
        linePrefix: linePrefix!,
        account: account!,
        data: ciphertext!,
        extended: [],
        timestamp: null,
      },
    };
  }
  const match = BODY.exec(body);
  if (!match) return fail('format', 'the body does not follow the DC-09 layout', body);
  const [, id, sequence, receiver, linePrefix, account, data, extendedText] = match;
  let timestamp: Date | null = null;
  if (match[8] !== undefined) {
    const [hh, mm, ss, month, day, year] = match.slice(8, 14).map(Number) as number[];
    timestamp = new Date(Date.UTC(year!, month! - 1, day!, hh!, mm!, ss!));
    const valid =
      timestamp.getUTCMonth() === month! - 1 &&
      timestamp.getUTCDate() === day &&
      hh! < 24 &&
      mm! < 60 &&
      ss! < 60;
    if (!valid) return fail('timestamp', 'the timestamp is not a real date and time', body);
  }
  return {
    ok: true,
    frame: {
      id: id!,
      encrypted: false,
      sequence: sequence!,
      receiver: receiver ?? null,
      linePrefix: linePrefix!,
      account: account!,
      data: data!,
      extended: extendedText ? [...extendedText.matchAll(/\[([^\]]*)\]/g)].map((m) => m[1]!) : [],
      timestamp,
    },
  };
}

const two = (value: number) => String(value).padStart(2, '0');

export function formatTimestamp(date: Date): string {
  return `_${two(date.getUTCHours())}:${two(date.getUTCMinutes())}:${two(date.getUTCSeconds())},${two(date.getUTCMonth() + 1)}-${two(date.getUTCDate())}-${date.getUTCFullYear()}`;
}

/** Wraps a body in LF, CRC, length and CR. */
export function wrapBody(body: string): string {
  const length = `0${body.length.toString(16).toUpperCase().padStart(3, '0')}`;
  return `${LF}${crcOf(body)}${length}${body}${CR}`;
}

/**
 * Builds a frame. For an encrypted one, `data` is the ciphertext's hex and nothing follows it
 * (dc09-encryption.ts makes it); its extended data and timestamp travel inside.
 */
export function buildFrame(frame: Omit<Dc09Frame, 'extended'> & { extended?: string[] }): string {
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  if (frame.encrypted)
    return wrapBody(
      `"*${frame.id}"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[${frame.data}`,
    );
  const extended = (frame.extended ?? []).map((block) => `[${block}]`).join('');
  const time = frame.timestamp ? formatTimestamp(frame.timestamp) : '';
  return wrapBody(
    `"${frame.id}"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[${frame.data}]${extended}${time}`,
  );
}

type ReplyTo = Pick<Dc09Frame, 'sequence' | 'receiver' | 'linePrefix' | 'account'>;

/** ACK: the header echoed with empty data, sent only once the signal is safely stored. */
export function ackFor(frame: ReplyTo): string {
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  return wrapBody(`"ACK"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[]`);
}

/** DUH: the frame was read but not understood (an ID or data the receiver does not handle). */
export function duhFor(frame: ReplyTo): string {
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  return wrapBody(`"DUH"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[]`);
}

/** NAK: refused (bad CRC, length or time); it carries the receiver's clock for the panel. */
export function nak(now: Date): string {
  return wrapBody(`"NAK"0000R0L0A0[]${formatTimestamp(now)}`);
}
