import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseFrame, wrapBody } from '../../server/monitoring/protocol/dc09';
import {
  aesCbcZeroIv,
  buildEncryptedFrame,
  decryptContent,
  decryptFrame,
  encryptContent,
  encryptedAckFor,
} from '../../server/monitoring/protocol/dc09-encryption';

const hex = (text: string) => Buffer.from(text, 'hex');

describe('AES-CBC with a zero IV', () => {
  // NIST SP 800-38A, appendix F.1 (ECB-AES128, -AES192, -AES256, first block): with an all-zero
  // IV the first CBC block is the ECB block, so these check the cipher and each key size.
  const PLAINTEXT_1 = '6bc1bee22e409f96e93d7e117393172a';
  const vectors = [
    ['2b7e151628aed2a6abf7158809cf4f3c', '3ad77bb40d7a3660a89ecaf32466ef97'],
    ['8e73b0f7da0e6452c810f32b809079e562f8ead2522c6b7b', 'bd334f1d6e45f25ff712a214571fa5cc'],
    [
      '603deb1015ca71be2b73aef0857d77811f352c073b6108d72d9810a30914dff4',
      'f3eed1bdb5d2a03c064b5a7e3db181f8',
    ],
  ] as const;

  it('matches NIST SP 800-38A F.1 for 128-, 192- and 256-bit keys, both ways', () => {
    for (const [key, ciphertext] of vectors) {
      expect(aesCbcZeroIv('encrypt', hex(key), hex(PLAINTEXT_1)).toString('hex')).toBe(ciphertext);
      expect(aesCbcZeroIv('decrypt', hex(key), hex(ciphertext)).toString('hex')).toBe(PLAINTEXT_1);
    }
  });

  it('chains blocks: P2 XOR C1 as the second block gives SP 800-38A F.1.1’s C2', () => {
    // CBC encrypts block 2 as AES(P2 XOR C1); feeding P2 XOR C1 through ECB's C1 must give
    // ECB's C2 (F.1.1: P2 ae2d8a57…, C2 f5d3d585…).
    const [key, c1] = vectors[0];
    const p2 = hex('ae2d8a571e03ac9c9eb76fac45af8e51');
    const chained = Buffer.from(p2.map((byte, index) => byte ^ hex(c1)[index]!));
    const out = aesCbcZeroIv('encrypt', hex(key), Buffer.concat([hex(PLAINTEXT_1), chained]));
    expect(out.toString('hex')).toBe(`${c1}f5d3d58503b9699de785895a96fdbaaf`);
  });

  it('refuses keys that are not 16, 24 or 32 bytes, and partial blocks', () => {
    expect(() => aesCbcZeroIv('encrypt', Buffer.alloc(15), Buffer.alloc(16))).toThrow(RangeError);
    expect(() => aesCbcZeroIv('encrypt', Buffer.alloc(16), Buffer.alloc(17))).toThrow(RangeError);
  });
});

describe('SIA DC-09 encrypted frames', () => {
  // eavanvalkenburg/pysiaalarm tests/test_sia_package_cases.py, case_null (also in
  // tests/test_sia_package.py): an encrypted link test from account AAAB. Its key is
  // tests/encrypted_config.json's "AAAAAAAAAAAAAAAA", which pysiaalarm uses as the bytes of
  // those sixteen characters (src/pysiaalarm/account.py: key.encode()), so in hex 41 × 16.
  const PYSIA_NULL =
    '76D80055"*NULL"0000R0L0#AAAB[B4BC8B40D0E6D959D6BEA78E88CC0B2155741A3C44FBB96D476A3E557CAD64D9';
  const PYSIA_KEY = '41'.repeat(16);

  it('reads pysiaalarm’s encrypted link test: CRC, length, then the decrypted timestamp', () => {
    const parsed = parseFrame(`\n${PYSIA_NULL}\r`);
    expect(parsed).toMatchObject({
      ok: true,
      frame: { id: 'NULL', encrypted: true, sequence: '0000', receiver: '0', account: 'AAAB' },
    });
    if (!parsed.ok) return;
    // The plaintext: eleven pad characters, the `]` of the empty data, then the timestamp.
    expect(decryptContent(PYSIA_KEY, parsed.frame.data)).toBe('ppppppppppp]_18:24:52,07-05-2020');
    expect(decryptFrame(parsed.frame, PYSIA_KEY)).toEqual({
      ok: true,
      frame: {
        ...parsed.frame,
        data: '',
        extended: [],
        timestamp: new Date(Date.UTC(2020, 6, 5, 18, 24, 52)),
      },
    });
  });

  it('encrypts to pysiaalarm’s ciphertext given the same pad', () => {
    const content = ']_18:24:52,07-05-2020';
    expect(encryptContent(PYSIA_KEY, content, (length) => 'p'.repeat(length))).toBe(
      PYSIA_NULL.slice(PYSIA_NULL.indexOf('[') + 1),
    );
  });

  it('pads to whole blocks, at least one character, a whole block when it already fits', () => {
    for (const length of [1, 15, 16, 17, 31, 32]) {
      const hexText = encryptContent(PYSIA_KEY, 'x'.repeat(length), (n) => '0'.repeat(n));
      const padded = Math.ceil((length + 1) / 16) * 16;
      expect(hexText.length / 2, `content of ${length}`).toBe(padded);
    }
  });

  const keyArbitrary = fc
    .constantFrom(16, 24, 32)
    .chain((bytes) => fc.uint8Array({ minLength: bytes, maxLength: bytes }))
    .map((bytes) => Buffer.from(bytes).toString('hex').toUpperCase());

  it('reads back every encrypted frame it builds, for all three key sizes (1,000 frames)', () => {
    fc.assert(
      fc.property(
        keyArbitrary,
        fc.constantFrom(
          { id: 'ADM-CID', data: '|1130 01 003' },
          { id: 'SIA-DCS', data: '|Nri1/BA03' },
          { id: 'NULL', data: '' },
        ),
        fc.integer({ min: 0, max: 9999 }),
        fc
          .date({ min: new Date('2020-01-01Z'), max: new Date('2040-01-01Z'), noInvalidDate: true })
          .map((date) => new Date(Math.floor(date.getTime() / 1000) * 1000)),
        (key, { id, data }, sequence, timestamp) => {
          const frame = {
            id,
            sequence: String(sequence).padStart(4, '0'),
            receiver: '1',
            linePrefix: '232',
            account: '4E21',
            data,
            timestamp,
          };
          const text = buildEncryptedFrame(frame, key);
          const parsed = parseFrame(text);
          expect(parsed.ok).toBe(true);
          if (!parsed.ok) return;
          expect(parsed.frame.encrypted).toBe(true);
          expect(decryptFrame(parsed.frame, key)).toEqual({
            ok: true,
            frame: { ...frame, encrypted: true, extended: [] },
          });
        },
      ),
      { numRuns: 1_000 },
    );
  });

  it('drops the pad and an account repeated before the |, and keeps extended data', () => {
    const key = '00112233445566778899AABBCCDDEEFF';
    const text = buildEncryptedFrame(
      {
        id: 'ADM-CID',
        sequence: '0042',
        receiver: null,
        linePrefix: '0',
        account: '1015',
        data: '#1015|1130 01 003',
        extended: ['X000E000W0'],
        timestamp: new Date(Date.UTC(2026, 11, 6, 9, 0, 0)),
      },
      key,
    );
    const parsed = parseFrame(text);
    if (!parsed.ok) throw new Error(parsed.detail);
    expect(decryptFrame(parsed.frame, key)).toMatchObject({
      ok: true,
      frame: { data: '|1130 01 003', extended: ['X000E000W0'] },
    });
  });

  it('takes pad characters that are control codes, as dc09_spt may send', () => {
    // jvanovost/dc09_spt dc09_spt/msg/dc09_msg.py, dc09crypt: pad characters are drawn from
    // codes 20 to 125, leaving out [ ] and |, so some are control characters.
    const key = '00112233445566778899AABBCCDDEEFF';
    const controlPad = (length: number) =>
      Array.from({ length }, (_, index) => String.fromCharCode(20 + (index % 12))).join('');
    const text = buildEncryptedFrame(
      {
        id: 'SIA-DCS',
        sequence: '0007',
        receiver: '1',
        linePrefix: '1',
        account: '1015',
        data: '|Nri1/BA03',
        timestamp: new Date(Date.UTC(2026, 11, 6, 9, 0, 0)),
      },
      key,
      controlPad,
    );
    const parsed = parseFrame(text);
    if (!parsed.ok) throw new Error(parsed.detail);
    expect(decryptFrame(parsed.frame, key)).toMatchObject({
      ok: true,
      frame: { data: '|Nri1/BA03' },
    });
  });

  it('refuses a wrong key, partial blocks, and a frame without its timestamp', () => {
    const key = '00112233445566778899AABBCCDDEEFF';
    const frame = {
      id: 'ADM-CID',
      sequence: '0001',
      receiver: '1',
      linePrefix: '1',
      account: '1015',
      data: '|1130 01 003',
      timestamp: new Date(Date.UTC(2026, 11, 6, 9, 0, 0)),
    };
    const parsed = parseFrame(buildEncryptedFrame(frame, key));
    if (!parsed.ok) throw new Error(parsed.detail);
    expect(decryptFrame(parsed.frame, 'FF'.repeat(16)).ok).toBe(false);
    expect(decryptFrame(parsed.frame, 'FF'.repeat(32)).ok).toBe(false);
    expect(decryptFrame({ ...parsed.frame, data: parsed.frame.data.slice(2) }, key).ok).toBe(false);
    expect(decryptFrame({ ...parsed.frame, data: '' }, key).ok).toBe(false);
    // DC-09 makes the timestamp mandatory inside an encrypted frame.
    const untimed = parseFrame(
      wrapBody(`"*ADM-CID"0001R1L1#1015[${encryptContent(key, '|1130 01 003]')}`),
    );
    if (!untimed.ok) throw new Error(untimed.detail);
    expect(decryptFrame(untimed.frame, key)).toEqual({
      ok: false,
      detail: 'an encrypted frame must carry a timestamp (SIA DC-09)',
    });
  });

  it('encrypts its ACK, with the receiver’s time inside', () => {
    const key = '00112233445566778899AABBCCDDEEFF0011223344556677';
    const now = new Date(Date.UTC(2026, 11, 6, 9, 30, 5));
    const reply = encryptedAckFor(
      { sequence: '0042', receiver: '1', linePrefix: '232', account: '1015' },
      key,
      now,
    );
    expect(reply).toMatch(/^\n[0-9A-F]{4}0[0-9A-F]{3}"\*ACK"0042R1L232#1015\[[0-9A-F]+\r$/);
    const parsed = parseFrame(reply);
    if (!parsed.ok) throw new Error(parsed.detail);
    expect(decryptFrame(parsed.frame, key)).toMatchObject({
      ok: true,
      frame: { id: 'ACK', data: '', timestamp: now },
    });
  });

  it('never throws on random ciphertext and keys (5,000 frames)', () => {
    fc.assert(
      fc.property(
        keyArbitrary,
        fc.constantFrom('ADM-CID', 'SIA-DCS', 'NULL'),
        fc.oneof(
          fc.uint8Array({ maxLength: 400 }).map((bytes) => Buffer.from(bytes).toString('hex')),
          fc.string({ unit: fc.constantFrom(...'0123456789ABCDEFabcdef'), maxLength: 300 }),
        ),
        (key, id, ciphertext) => {
          const parsed = parseFrame(wrapBody(`"*${id}"0001R1L1#1015[${ciphertext}`));
          if (!parsed.ok) return;
          const result = decryptFrame(parsed.frame, key);
          expect(typeof result.ok).toBe('boolean');
        },
      ),
      { numRuns: 5_000 },
    );
  });
});
