import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contactIdCategory,
  contactIdChecksum,
  isValidContactIdMessage,
  parseAdmCidData,
  parseSiaDcsData,
} from '../../server/monitoring/protocol/contact-id';
import {
  ackFor,
  buildFrame,
  crcOf,
  duhFor,
  MAX_FRAME_CHARS,
  nak,
  parseFrame,
  wrapBody,
  type Dc09Frame,
} from '../../server/monitoring/protocol/dc09';

describe('CRC-16/ARC', () => {
  it('gives the catalogue check value for "123456789"', () => {
    // CRC RevEng catalogue, CRC-16/ARC: poly 0x8005 reflected, init 0, check 0xBB3D.
    expect(crcOf('123456789')).toBe('BB3D');
  });
});

describe('SIA DC-09 frames', () => {
  // eavanvalkenburg/pysiaalarm tests/test_sia_package_cases.py (via ../shared/checks.md):
  // this body has CRC CE11 and length 0032.
  const BODY = '"SIA-DCS"9876R579BDFL789ABC#12345A[#12345A|NFA129]';

  it('frames the worked example with CRC CE11 and length 0032', () => {
    expect(wrapBody(BODY)).toBe(`\nCE110032${BODY}\r`);
  });

  it('reads the worked example field by field', () => {
    const parsed = parseFrame(`\nCE110032${BODY}\r`);
    expect(parsed).toEqual({
      ok: true,
      frame: {
        id: 'SIA-DCS',
        encrypted: false,
        sequence: '9876',
        receiver: '579BDF',
        linePrefix: '789ABC',
        account: '12345A',
        data: '#12345A|NFA129',
        extended: [],
        timestamp: null,
      },
    });
    // NFA129: new fire alarm on zone 129 (SIA-DCS event code FA).
    expect(parseSiaDcsData('#12345A|NFA129')).toMatchObject({
      account: '12345A',
      code: 'FA',
      zoneOrUser: 129,
      category: 'fire',
      qualifier: 'new',
    });
  });

  it('reads the timestamp and extended data', () => {
    const frame: Dc09Frame = {
      id: 'ADM-CID',
      encrypted: false,
      sequence: '0042',
      receiver: '1',
      linePrefix: '232',
      account: '4E21',
      data: '#4E21|1130 01 003',
      extended: ['X000E000W0'],
      timestamp: new Date(Date.UTC(2026, 11, 2, 10, 15, 30)),
    };
    const text = buildFrame(frame);
    expect(text).toContain('_10:15:30,12-02-2026\r');
    expect(parseFrame(text)).toEqual({ ok: true, frame });
  });

  it('refuses a wrong CRC, a wrong length, an impossible time and an oversized frame', () => {
    expect(parseFrame(`\nCE120032${BODY}\r`)).toMatchObject({ ok: false, problem: 'crc' });
    expect(parseFrame(`\nCE110033${BODY}\r`)).toMatchObject({ ok: false, problem: 'length' });
    const badTime = wrapBody('"NULL"0001L0#1234[]_10:15:30,02-30-2026');
    expect(parseFrame(badTime)).toMatchObject({ ok: false, problem: 'timestamp' });
    expect(parseFrame(`\n${'A'.repeat(MAX_FRAME_CHARS + 1)}\r`)).toMatchObject({
      ok: false,
      problem: 'too_long',
    });
    // A refused frame still names its sequence and account where they can be read.
    expect(parseFrame(`\nCE120032${BODY}\r`)).toMatchObject({
      header: { sequence: '9876', account: '12345A' },
    });
  });

  it('builds replies whose CRC and length check out', () => {
    const header = {
      sequence: '9876',
      receiver: '579BDF',
      linePrefix: '789ABC',
      account: '12345A',
    };
    const ack = parseFrame(ackFor(header));
    expect(ack).toMatchObject({ ok: true, frame: { id: 'ACK', data: '', ...header } });
    expect(parseFrame(duhFor(header))).toMatchObject({ ok: true, frame: { id: 'DUH' } });
    const refusal = nak(new Date(Date.UTC(2026, 11, 2, 9, 0, 5)));
    const body = refusal.slice(9, -1);
    expect(body).toBe('"NAK"0000R0L0A0[]_09:00:05,12-02-2026');
    expect(refusal.slice(1, 5)).toBe(crcOf(body));
    expect(Number.parseInt(refusal.slice(5, 9), 16)).toBe(body.length);
  });

  it('never throws on 10,000 random inputs, and refuses them', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 1200 }), (text) => {
        const parsed = parseFrame(text);
        expect(typeof parsed.ok).toBe('boolean');
      }),
      { numRuns: 10_000 },
    );
  });

  it('refuses every one-character change to a valid frame (10,000 mutations)', () => {
    const valid = `\nCE110032${BODY}\r`;
    fc.assert(
      fc.property(
        fc.nat({ max: valid.length - 1 }),
        fc.integer({ min: 0x20, max: 0x7e }),
        (index, code) => {
          const replacement = String.fromCharCode(code);
          fc.pre(valid[index] !== replacement);
          const mutated = valid.slice(0, index) + replacement + valid.slice(index + 1);
          expect(parseFrame(mutated).ok).toBe(false);
        },
      ),
      { numRuns: 10_000 },
    );
  });

  it('reads back every frame it builds', () => {
    const hex = (min: number, max: number) =>
      fc.string({ unit: fc.constantFrom(...'0123456789ABCDEF'), minLength: min, maxLength: max });
    fc.assert(
      fc.property(
        fc.record({
          id: fc.constantFrom('SIA-DCS', 'ADM-CID', 'NULL'),
          encrypted: fc.constant(false),
          sequence: fc.integer({ min: 0, max: 9999 }).map((n) => String(n).padStart(4, '0')),
          receiver: fc.option(hex(1, 6), { nil: null }),
          linePrefix: hex(1, 6),
          account: hex(3, 16),
          data: fc.string({ unit: fc.constantFrom(...'#|0123456789ABCDEFNri/ '), maxLength: 40 }),
          extended: fc.array(hex(0, 12), { maxLength: 2 }),
          timestamp: fc.option(
            fc
              .date({
                min: new Date('2000-01-01T00:00:00Z'),
                max: new Date('2099-12-31T23:59:59Z'),
                noInvalidDate: true,
              })
              .map((date) => new Date(Math.floor(date.getTime() / 1000) * 1000)),
            { nil: null },
          ),
        }),
        (frame) => {
          expect(parseFrame(buildFrame(frame))).toEqual({ ok: true, frame });
        },
      ),
      { numRuns: 2_000 },
    );
    // The encrypted form: the header, `[`, the ciphertext's hex and nothing after it.
    fc.assert(
      fc.property(
        fc.record({
          id: fc.constantFrom('SIA-DCS', 'ADM-CID', 'NULL'),
          encrypted: fc.constant(true),
          sequence: fc.integer({ min: 0, max: 9999 }).map((n) => String(n).padStart(4, '0')),
          receiver: fc.option(hex(1, 6), { nil: null }),
          linePrefix: hex(1, 6),
          account: hex(3, 16),
          data: fc.integer({ min: 1, max: 12 }).chain((blocks) => hex(blocks * 32, blocks * 32)),
          extended: fc.constant<string[]>([]),
          timestamp: fc.constant(null),
        }),
        (frame) => {
          const text = buildFrame(frame);
          expect(text).toMatch(/\[[0-9A-F]+\r$/);
          expect(parseFrame(text)).toEqual({ ok: true, frame });
        },
      ),
      { numRuns: 1_000 },
    );
  });

  it('never throws on random text after a `*` message ID (10,000 frames with a good CRC)', () => {
    // Whatever follows "*ADM-CID" and the header, framed with a correct CRC and length, is
    // read or refused, never thrown on.
    fc.assert(
      fc.property(
        fc.constantFrom('*ADM-CID', '*SIA-DCS', '*NULL', '*'),
        fc.string({ maxLength: 600 }),
        (id, rest) => {
          const parsed = parseFrame(wrapBody(`"${id}"0001R1L1#1234[${rest}`));
          expect(typeof parsed.ok).toBe('boolean');
        },
      ),
      { numRuns: 10_000 },
    );
  });
});

describe('Contact ID', () => {
  it('gives the worked checksum: 1234 18 1 131 01 015 has S = 8', () => {
    // freeswitch/spandsp src/ademco_contactid.c and tests/ademco_contactid_tests.c.
    expect(contactIdChecksum('1234 18 1 131 01 015')).toBe('8');
    expect(isValidContactIdMessage('1234 18 1 131 01 015 8')).toBe(true);
    expect(isValidContactIdMessage('1234 18 1 131 01 015 7')).toBe(false);
  });

  it('sends a checksum of 15 as F, and counts 0 as 10', () => {
    // 1111 18 1 130 01 001: digits sum to 1+1+1+1+1+8+1+1+3+10+10+1+10+10+1 = 60, a multiple
    // of 15, so S is 15 and is sent as F (the rule in spandsp's ademco_contactid.c).
    expect(contactIdChecksum('111118113001001')).toBe('F');
    expect(isValidContactIdMessage('111118113001001F')).toBe(true);
  });

  it('maps event codes to the categories operators work by', () => {
    // Event codes as listed in spandsp's ademco_contactid.c (../shared/checks.md).
    const expected: Record<string, string> = {
      '110': 'fire',
      '120': 'hold_up',
      '121': 'hold_up',
      '130': 'burglary',
      '131': 'burglary',
      '136': 'burglary',
      '137': 'tamper',
      '144': 'tamper',
      '301': 'fault',
      '302': 'fault',
      '401': 'open_close',
      '602': 'test',
    };
    for (const [code, category] of Object.entries(expected)) {
      expect(contactIdCategory(code), code).toBe(category);
    }
  });

  it('reads ADM-CID data: new, restore and still-present events', () => {
    expect(parseAdmCidData('#1234|1131 01 015')).toEqual({
      account: '1234',
      qualifier: 'new',
      code: '131',
      partition: 1,
      zoneOrUser: 15,
      category: 'burglary',
    });
    expect(parseAdmCidData('#1234|3131 01 015')?.qualifier).toBe('restore');
    expect(parseAdmCidData('6302 00 000')).toMatchObject({
      qualifier: 'status',
      category: 'fault',
    });
    expect(parseAdmCidData('#1234|9131 01 015')).toBeUndefined();
    expect(parseAdmCidData('')).toBeUndefined();
  });

  it('reads data that leaves the account out before the |', () => {
    // eavanvalkenburg/pysiaalarm tests/test_sia_package_cases.py, case_cl:
    // "SIA-DCS"6002L0#AAA[|Nri1/CL501]_14:12:04,09-25-2019 is a closing report (CL).
    expect(parseSiaDcsData('|Nri1/CL501')).toMatchObject({
      account: null,
      code: 'CL',
      area: 1,
      category: 'open_close',
    });
    expect(parseAdmCidData('|1130 01 003')).toMatchObject({
      account: null,
      code: '130',
      zoneOrUser: 3,
      category: 'burglary',
    });
  });
});
