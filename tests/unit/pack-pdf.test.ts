import { beforeAll, describe, expect, it } from 'vitest';
import { renderPackPdf } from '../../server/handover/pdf/render-pack';
import type { PackSnapshot } from '../../server/handover/snapshot';
import { packSnapshotFixture } from '../setup/pack-snapshot-fixture';
import { pageTexts } from '../setup/pdf-text';

/**
 * The handover pack rendered for real from the invented fixture, read back with pdf.js (a PDF
 * reader the project did not write): what a homeowner or auditor would find on each page.
 */

interface Rendered {
  snapshot: PackSnapshot;
  pdf: Buffer;
  pages: string[];
  all: string;
}

async function render(options: { zones?: number; preview?: boolean }): Promise<Rendered> {
  const snapshot = packSnapshotFixture(options);
  const pdf = await renderPackPdf(snapshot);
  const pages = await pageTexts(pdf);
  return { snapshot, pdf, pages, all: pages.join(' ') };
}

/** The first page after the cover (which lists every section) with this heading. */
const pageWith = (pack: Rendered, heading: string) => {
  const page = pack.pages.slice(1).find((text) => text.includes(heading));
  if (!page) throw new Error(`no page has "${heading}"`);
  return page;
};

// Rendering is CPU-bound and the machine is shared: allow for a slow build.
const RENDER_TIMEOUT = 180_000;

let issued: Rendered;
let long: Rendered;
let preview: Rendered;

beforeAll(async () => {
  issued = await render({});
  long = await render({ zones: 40 });
  preview = await render({ preview: true });
}, RENDER_TIMEOUT);

describe('handover pack PDF', () => {
  it('is a PDF file', () => {
    for (const pack of [issued, long, preview]) {
      expect(pack.pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    }
  });

  it('has every section of the pack (product.md, capability 6)', () => {
    for (const heading of [
      'Handover pack',
      'Completion certificate',
      'As-fitted zone schedule',
      'Devices',
      'Power budget',
      'Keyholders and call order',
      'User-code slots',
      'Monitoring and police response',
      'Signalling paths',
      'Service plan',
      'User guide',
      'Safety cautions',
      'Sign-off',
    ]) {
      expect(issued.all).toContain(heading);
    }
  });

  it('carries the pack number and "Page N of M" on every page', () => {
    const total = issued.pages.length;
    expect(total).toBeGreaterThan(5);
    expect(issued.pages[0]).toContain(`Page 1 of ${total}`);
    issued.pages.forEach((text, index) => {
      expect(text).toContain(issued.snapshot.packNumber);
      expect(text).toContain(`Page ${index + 1} of ${total}`);
      expect(text).toContain(issued.snapshot.installer.name);
    });
  });

  it('shows the site, revision, issue date and verification address on the cover', () => {
    const cover = issued.pages[0]!;
    expect(cover).toContain('Marsh residence');
    expect(cover).toContain('14 Kestrel Lane');
    expect(cover).toContain('supersedes FA-000147-R1');
    // 15:40 UTC on 2 December is the same day in Europe/London.
    expect(cover).toContain('2 December 2026');
    // The cover breaks the address over lines to fit beside the QR code.
    expect(cover.replace(/\s/g, '')).toContain(issued.snapshot.verifyUrl);
    expect(pageWith(issued, 'Sign-off')).toContain(issued.snapshot.verifyUrl);
  });

  it('states grade, notification, standards, the accepted variation and test results', () => {
    const certificate = pageWith(issued, 'Completion certificate');
    expect(certificate).toContain('Grade 2');
    expect(certificate).toContain('Class II');
    expect(certificate).toContain('Option C (PD 6662)');
    expect(certificate).toContain('BS 8243');
    expect(certificate).toContain('Zone 6 (garage side door)');
    expect(certificate).toMatch(/Sounders PASS/);
    expect(certificate).toMatch(/Battery PASS/);
  });

  it('lists every zone with its expected and measured loop readings', () => {
    const schedule = issued.pages
      .filter((text) => text.includes('Measured secure / alarm'))
      .join(' ');
    for (const zone of issued.snapshot.zones) expect(schedule).toContain(zone.location);
    // Two-resistor loop 2K2 / 4K7: 2.2 kΩ secure, 2.2 + 4.7 = 6.9 kΩ in alarm; a 1K / 1K pair
    // reads 1 kΩ and 2 kΩ (worked examples in ../shared/checks.md, common practice).
    expect(schedule).toContain('2.2 kΩ 6.9 kΩ');
    expect(schedule).toContain('1 kΩ 2 kΩ');
    // The closed loop opens in alarm; the meter reads OL.
    expect(schedule).toContain('Open circuit');
    expect(schedule).toContain('OL · Alarm');
    // The loop gauge names its bands in words, not colour alone (product.md, look and feel).
    expect(schedule).toContain('Short Normal Alarm Open');
    expect(schedule).toContain('measured 2.21 kΩ');
    // Zone 6 reads 2.71 kΩ: beyond 2.2 kΩ + 5 % + cable, so out of tolerance and failed.
    expect(schedule).toMatch(/2\.71 kΩ · Out of tolerance .*FAIL/);
    expect(schedule).toContain('All clear');
  });

  it('spells out the power budget with its result in words', () => {
    const power = pageWith(issued, 'Power budget');
    // Battery capacity = (I_quiescent × T_standby + I_alarm × T_alarm) × ageing factor, 1.25
    // (../shared/checks.md, common practice): (0.225 A × 12 h + 0.92 A × 0.25 h) × 1.25
    // = (2.7 + 0.23) × 1.25 = 3.6625 Ah.
    expect(power).toContain(
      'Required Ah = (quiescent A × standby h + alarm A × alarm h) × ageing factor',
    );
    expect(power).toContain('(0.225 A × 12 h + 0.92 A × 0.25 h) × 1.25 = 3.66 Ah');
    expect(power).toContain('3.66 Ah');
    expect(power).toContain('7.00 Ah');
    expect(power).toContain('PASS');
  });

  it('lists keyholders in call order, slots without codes, monitoring and the URN', () => {
    const people = pageWith(issued, 'Keyholders and call order');
    const order = ['Sam Whitlock', 'Priti Lindqvist', 'Oliver Quayle'].map((name) =>
      people.indexOf(name),
    );
    expect(order.every((position) => position >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    expect(people).toContain('07700 900312');
    expect(people).toContain('No user codes are recorded in this pack or in Wardbook');
    expect(people).toContain('Level 3 (engineer)');
    expect(people).toContain('Halden Watch Monitoring');
    expect(people).toContain('4E21');
    expect(people).toContain('EMP/IA/26/0193');
    expect(people).toContain('2 visits a year');
    expect(people).toContain('2 June 2027');
  });

  it('explains setting, part-setting, unsetting and false alarms in plain words', () => {
    const guide = pageWith(issued, 'User guide');
    // EN 50131's three states.
    for (const word of ['set', 'part-set', 'unset']) expect(guide).toContain(word);
    expect(guide).toContain('Front door, then Hall and stairs');
    expect(guide).toContain('give them your password');
    expect(guide).toContain('Do not set the system again until you know what caused it');
    expect(guide).toContain('pets');
    expect(guide).toContain('07700 900100');
  });

  it('carries the safety cautions', () => {
    const safety = pageWith(issued, 'Safety cautions');
    // HSE INDG455, "Safe use of ladders and stepladders": short-duration work, 1 in 4 (75°),
    // three points of contact, 1 m above the landing point.
    expect(safety).toContain('short-duration');
    expect(safety).toContain('1-in-4');
    expect(safety).toContain('three points of contact');
    expect(safety).toContain('1 m above');
    // product.md "Safety" and ../shared/trade.md section 5.
    expect(safety).toContain('hidden cables and pipes');
    expect(safety).toContain('prove it dead');
    expect(safety).toContain('built or refurbished before 2000');
    expect(safety).toContain('Lone working');
    expect(safety).toContain('signs of forced entry');
    expect(safety).toContain('Wait at a safe distance for the police');
    expect(safety).toContain('Loft hatch over the stairwell');
    expect(safety).toContain('licensed practice');
  });

  it('has both signatures with names and dates, and the acceptance of the variation', () => {
    const signOff = pageWith(issued, 'Sign-off');
    expect(signOff).toContain('Callum Reyes');
    expect(signOff).toContain('Helen Marsh');
    expect(signOff).toContain('accepted the variation listed on the completion certificate');
    expect(issued.all).not.toContain('PREVIEW');
  });

  it('repeats the zone schedule header on every page a long schedule runs onto', () => {
    const schedulePages = long.pages.filter((text) => text.includes('Measured secure / alarm'));
    expect(schedulePages.length).toBeGreaterThan(1);
    for (const text of schedulePages) expect(text).toContain('Zone Location Area Zone type');
    const schedule = schedulePages.join(' ');
    for (const zone of long.snapshot.zones) expect(schedule).toContain(zone.location);
    expect(long.pages.length).toBeGreaterThan(issued.pages.length);
    const total = long.pages.length;
    long.pages.forEach((text, index) => expect(text).toContain(`Page ${index + 1} of ${total}`));
  });

  it('marks every page of a preview, with empty signing boxes', () => {
    for (const text of preview.pages) expect(text).toContain('PREVIEW — not issued');
    const signOff = pageWith(preview, 'Sign-off');
    expect(signOff).toContain('Signature');
    expect(signOff).not.toContain('Callum Reyes');
    expect(pageWith(preview, 'Completion certificate')).toContain('Not yet accepted');
  });

  // The seal is over the file's bytes, so a snapshot must always give the same file. Builds
  // run at the same time, the way the PDF writer's background work is most likely to
  // interleave (transparent images once made the output vary: server/handover/pdf/images.ts).
  it(
    'draws the same file from the same snapshot, even when built at the same time',
    async () => {
      const again = await Promise.all([
        renderPackPdf(issued.snapshot),
        renderPackPdf(issued.snapshot),
      ]);
      for (const pdf of again) expect(pdf.equals(issued.pdf)).toBe(true);
    },
    RENDER_TIMEOUT,
  );
});
