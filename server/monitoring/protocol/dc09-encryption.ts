import { createCipheriv, createDecipheriv, randomInt } from 'node:crypto';
import { formatTimestamp, parseFrame, wrapBody, type Dc09Frame } from './dc09';

/**
 * SIA DC-09 encryption, pure apart from the random pad. In an encrypted frame the message ID
 * carries a `*` ("*SIA-DCS", "*ADM-CID", "*NULL"), the `[` stays in clear, and everything after
 * it — pad, data, `]`, extended data and the timestamp, which is then mandatory — is AES-CBC
 * with an all-zero IV and no further padding, sent as upper-case hex. The pad goes in front so
 * the plaintext fills whole 16-byte blocks; its characters are never `|`, `[` or `]`, so the
 * data is found at the first `|` (and a link test, with no data, has no `|` at all).
 *
 * Sources: jvanovost/dc09_spt dc09_spt/msg/dc09_msg.py (dc09crypt, dc09block) and
 * eavanvalkenburg/pysiaalarm (src/pysiaalarm/event.py, tests/test_utils.py, and the encrypted
 * test frames of tests/test_sia_package_cases.py). Replies to an encrypted frame are encrypted
 * the same way: `"*ACK"seq…#acct[` then the ciphertext of pad + `]` + the receiver's time.
 */

export const AES_BLOCK_BYTES = 16;

const PAD_ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** Random pad characters: letters and digits, so never `|`, `[` or `]`. */
export const randomPad = (length: number) =>
  Array.from({ length }, () => PAD_ALPHABET[randomInt(PAD_ALPHABET.length)]).join('');

function cipherName(key: Buffer) {
  return `aes-${key.length * 8}-cbc` as const;
}

/** AES-CBC with a zero IV and no padding of its own; `data` must be whole blocks. */
export function aesCbcZeroIv(direction: 'encrypt' | 'decrypt', key: Buffer, data: Buffer): Buffer {
  if (![16, 24, 32].includes(key.length)) throw new RangeError('AES keys are 16, 24 or 32 bytes');
  if (data.length % AES_BLOCK_BYTES !== 0) throw new RangeError('not whole 16-byte blocks');
  const iv = Buffer.alloc(AES_BLOCK_BYTES);
  const cipher =
    direction === 'encrypt'
      ? createCipheriv(cipherName(key), key, iv)
      : createDecipheriv(cipherName(key), key, iv);
  cipher.setAutoPadding(false);
  return Buffer.concat([cipher.update(data), cipher.final()]);
}

/** Keys are kept as hex: 32, 48 or 64 digits for AES-128, -192 or -256. */
const keyBytes = (keyHex: string) => Buffer.from(keyHex, 'hex');

/**
 * Encrypts the text after the `[`: pad characters in front so it fills whole blocks (at least
 * one, a whole block when it already fits, as pysiaalarm's test helper does), upper-case hex.
 */
export function encryptContent(
  keyHex: string,
  content: string,
  pad: (length: number) => string = randomPad,
): string {
  const padLength = AES_BLOCK_BYTES - (content.length % AES_BLOCK_BYTES);
  const plaintext = Buffer.from(pad(padLength) + content, 'latin1');
  return aesCbcZeroIv('encrypt', keyBytes(keyHex), plaintext).toString('hex').toUpperCase();
}

/** The text after the `[`, pad included, or null when the hex is not whole blocks. */
export function decryptContent(keyHex: string, hex: string): string | null {
  if (hex.length === 0 || !/^(?:[0-9A-Fa-f]{32})+$/.test(hex)) return null;
  return aesCbcZeroIv('decrypt', keyBytes(keyHex), Buffer.from(hex, 'hex')).toString('latin1');
}

export type Decryption = { ok: true; frame: Dc09Frame } | { ok: false; detail: string };

/**
 * Decrypts an encrypted frame with the account's key and reads it as the plain frame it
 * carries, so it meets exactly the checks a plain frame does. A wrong key gives bytes that are
 * not text, or text without the `]` and timestamp every encrypted frame must end with.
 */
export function decryptFrame(frame: Dc09Frame, keyHex: string): Decryption {
  if (!frame.encrypted) return { ok: false, detail: 'the frame is not encrypted' };
  const plaintext = decryptContent(keyHex, frame.data);
  if (plaintext === null) return { ok: false, detail: 'the ciphertext is not whole AES blocks' };
  const close = plaintext.indexOf(']');
  if (close === -1) return { ok: false, detail: 'no ] after the data: wrong key?' };
  const padAndData = plaintext.slice(0, close);
  if (padAndData.includes('[')) return { ok: false, detail: 'a [ inside the pad or data' };
  const bar = padAndData.indexOf('|');
  // The account, if the panel repeated it before the `|`, cannot be told from the pad; the
  // header names it in clear anyway.
  const data = bar === -1 ? '' : padAndData.slice(bar);
  // Pad characters may be anything but | [ ] (dc09_spt draws them from codes 20 to 125, control
  // characters included), so only what follows the pad must be readable text.
  if (!/^[\x20-\x7E]*$/.test(data + plaintext.slice(close)))
    return { ok: false, detail: 'the decrypted text is not readable: wrong key?' };
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  const plainBody = `"${frame.id}"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[${data}${plaintext.slice(close)}`;
  const parsed = parseFrame(wrapBody(plainBody));
  if (!parsed.ok) return { ok: false, detail: `inside the encryption: ${parsed.detail}` };
  if (!parsed.frame.timestamp)
    return { ok: false, detail: 'an encrypted frame must carry a timestamp (SIA DC-09)' };
  return { ok: true, frame: { ...parsed.frame, encrypted: true } };
}

/**
 * An encrypted frame as a panel sends it: `data` is the plain data (e.g. `#1234|1130 01 003`
 * or `|Nri1/BA03`), encrypted with the extended data and timestamp behind it.
 */
export function buildEncryptedFrame(
  frame: Omit<Dc09Frame, 'encrypted' | 'extended' | 'timestamp'> & {
    extended?: string[];
    timestamp: Date;
  },
  keyHex: string,
  pad: (length: number) => string = randomPad,
): string {
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  const extended = (frame.extended ?? []).map((block) => `[${block}]`).join('');
  const content = `${frame.data}]${extended}${formatTimestamp(frame.timestamp)}`;
  return wrapBody(
    `"*${frame.id}"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[${encryptContent(keyHex, content, pad)}`,
  );
}

type ReplyTo = Pick<Dc09Frame, 'sequence' | 'receiver' | 'linePrefix' | 'account'>;

/** The ACK to an encrypted frame: encrypted, carrying the receiver's time inside. */
export function encryptedAckFor(
  frame: ReplyTo,
  keyHex: string,
  now: Date,
  pad: (length: number) => string = randomPad,
): string {
  const receiver = frame.receiver === null ? '' : `R${frame.receiver}`;
  const content = `]${formatTimestamp(now)}`;
  return wrapBody(
    `"*ACK"${frame.sequence}${receiver}L${frame.linePrefix}#${frame.account}[${encryptContent(keyHex, content, pad)}`,
  );
}
