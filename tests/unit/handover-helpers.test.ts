import type { PackSummary } from '@server/handover/schema';
import { describe, expect, it } from 'vitest';
import {
  fitFactor,
  maxDataUrlLength,
  scaleStrokes,
} from '../../src/components/ui/signature-strokes';
import {
  formatPackNumber,
  groupPacksByHome,
  nextPackNumberPreview,
  normalisePackNumber,
  packDocumentNumber,
} from '../../src/features/handover/utils/pack-numbers';
import { packStatusWords } from '../../src/features/handover/utils/pack-status';
import {
  EMPTY_SIGNATURE_MESSAGE,
  engineerSignatureFormSchema,
  namedSignatureFormSchema,
  ownSignatureFormSchema,
} from '../../src/features/handover/utils/signature-form';

function pack(packNumber: string, overrides: Partial<PackSummary> = {}): PackSummary {
  const revision = Number(packNumber.split('-R')[1]);
  return {
    packNumber,
    revision,
    siteId: 'site-a',
    siteName: 'Orchard Cottage',
    status: 'valid',
    supersededBy: null,
    revokedReason: null,
    issuedAt: '2026-03-01T10:00:00.000Z',
    issuedBy: 'Priya Lindqvist',
    sha256: 'ab'.repeat(32),
    sizeBytes: 120_000,
    downloadUrl: `/api/packs/${packNumber}/pdf`,
    verifyUrl: `/verify/${packNumber}`,
    ...overrides,
  };
}

describe('pack numbers', () => {
  it('pads the number to six digits and adds the revision', () => {
    expect(formatPackNumber('HW', 43)).toBe('HW-000043-R1');
    expect(formatPackNumber('WB', 1_234_567, 12)).toBe('WB-1234567-R12');
  });

  it('previews the next number only for a prefix the API would take', () => {
    expect(nextPackNumberPreview(' hw ', 43)).toBe('HW-000043-R1');
    expect(nextPackNumberPreview('H', 43)).toBeNull();
    expect(nextPackNumberPreview('HW1', 43)).toBeNull();
    expect(nextPackNumberPreview('ABCDEFG', 43)).toBeNull();
  });

  it('reads a typed pack number in upper case, or refuses it', () => {
    expect(normalisePackNumber('  hw-000042-r2 ')).toBe('HW-000042-R2');
    expect(normalisePackNumber('HW-42-R2')).toBeNull();
    expect(normalisePackNumber('HW-000042')).toBeNull();
  });

  it('names the document that a revision belongs to', () => {
    expect(packDocumentNumber('HW-000042-R12')).toBe('HW-000042');
  });
});

describe('grouping packs by home and document', () => {
  it('puts revisions of one document together, newest revision first', () => {
    const groups = groupPacksByHome([
      pack('HW-000042-R1', { status: 'superseded', supersededBy: 'HW-000042-R2' }),
      pack('HW-000050-R1', {
        siteId: 'site-b',
        siteName: 'Beech House',
        issuedAt: '2026-04-01T09:00:00.000Z',
      }),
      pack('HW-000042-R2', { issuedAt: '2026-03-09T10:00:00.000Z' }),
      pack('HW-000044-R1', { issuedAt: '2026-05-01T10:00:00.000Z' }),
    ]);
    expect(groups.map((home) => home.siteName)).toEqual(['Beech House', 'Orchard Cottage']);
    const orchard = groups[1]!;
    expect(orchard.documents.map((document) => document.documentNumber)).toEqual([
      'HW-000044',
      'HW-000042',
    ]);
    expect(orchard.documents[1]!.revisions.map((revision) => revision.packNumber)).toEqual([
      'HW-000042-R2',
      'HW-000042-R1',
    ]);
  });

  it('gives nothing for no packs', () => {
    expect(groupPacksByHome([])).toEqual([]);
  });
});

describe('pack status in words', () => {
  it('says what replaced a superseded pack and why one was revoked', () => {
    expect(packStatusWords('valid', null)).toBe('Valid');
    expect(packStatusWords('superseded', 'HW-000042-R2')).toBe('Superseded by HW-000042-R2');
    expect(packStatusWords('revoked', null, 'Issued for the wrong site')).toBe(
      'Revoked: Issued for the wrong site',
    );
    expect(packStatusWords('revoked', null)).toBe('Revoked');
  });
});

describe('signature pad drawing', () => {
  const stroke = {
    dotSize: 0,
    minWidth: 0.9,
    maxWidth: 3,
    penColor: '#14213D',
    velocityFilterWeight: 0.7,
    compositeOperation: 'source-over' as const,
    points: [
      { x: 100, y: 50, pressure: 0.5, time: 1 },
      { x: 300, y: 150, pressure: 0.5, time: 2 },
    ],
  };

  it('shrinks a drawing to fit a narrower box, keeping its shape', () => {
    expect(fitFactor({ width: 600, height: 200 }, { width: 300, height: 200 })).toBe(0.5);
    expect(fitFactor({ width: 600, height: 200 }, { width: 600, height: 100 })).toBe(0.5);
  });

  it('never enlarges a drawing, and leaves it alone when a size is unknown', () => {
    expect(fitFactor({ width: 300, height: 200 }, { width: 900, height: 400 })).toBe(1);
    expect(fitFactor({ width: 0, height: 0 }, { width: 300, height: 200 })).toBe(1);
  });

  it('moves every point and keeps the pen settings', () => {
    const [scaled] = scaleStrokes([stroke], 0.5);
    expect(scaled!.points.map(({ x, y }) => [x, y])).toEqual([
      [50, 25],
      [150, 75],
    ]);
    expect(scaled!.maxWidth).toBe(3);
    expect(stroke.points[0]!.x).toBe(100);
  });

  it('allows for base64 and the data URL prefix in the size limit', () => {
    expect(maxDataUrlLength(3)).toBe(4 + 'data:image/png;base64,'.length);
  });
});

describe('signature forms', () => {
  it('asks for a drawing, in plain words, when the pad is empty', () => {
    const result = namedSignatureFormSchema.safeParse({ name: 'Amara Okafor', image: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.message)).toEqual([EMPTY_SIGNATURE_MESSAGE]);
  });

  it('takes a PNG data URL and a name', () => {
    const result = namedSignatureFormSchema.safeParse({
      name: ' Amara Okafor ',
      image: 'data:image/png;base64,iVBORw0KGgo=',
    });
    expect(result.success).toBe(true);
    expect(result.data?.name).toBe('Amara Okafor');
  });

  it('refuses anything that is not a PNG from the pad', () => {
    const result = namedSignatureFormSchema.safeParse({
      name: 'Amara Okafor',
      image: 'data:image/jpeg;base64,AAAA',
    });
    expect(result.success).toBe(false);
  });

  it('speaks to the homeowner about their own name', () => {
    const result = ownSignatureFormSchema.safeParse({
      name: ' ',
      image: 'data:image/png;base64,iVBORw0KGgo=',
    });
    expect(result.error?.issues.map((issue) => issue.message)).toEqual(['Your name is required.']);
  });

  it('asks the engineer for the drawing alone', () => {
    expect(engineerSignatureFormSchema.safeParse({ name: '', image: '' }).error?.issues).toEqual([
      expect.objectContaining({ path: ['image'], message: EMPTY_SIGNATURE_MESSAGE }),
    ]);
  });
});
