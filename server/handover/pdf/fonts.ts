import { readFileSync } from 'node:fs';
import path from 'node:path';
import { inflateSync } from 'node:zlib';
import { Font } from '@react-pdf/renderer';
import { fontsDir } from '../../paths';

/** Font family names used by the pack's styles. */
export const SANS = 'IBM Plex Sans';
export const MONO = 'IBM Plex Mono';

/**
 * Unpacks a WOFF 1.0 file into the plain TrueType/OpenType font inside it (W3C WOFF 1.0,
 * sections 3–5: a header, a table directory, each table zlib-compressed unless compressing
 * did not help). react-pdf can read WOFF itself, but its font library inflates a table again
 * on every read, which made inflating glyph outlines most of a pack's build time.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('not a WOFF 1.0 file');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, index) => {
    const entry = 44 + index * 20;
    const offset = woff.readUInt32BE(entry + 4);
    const compLength = woff.readUInt32BE(entry + 8);
    const origLength = woff.readUInt32BE(entry + 12);
    const stored = woff.subarray(offset, offset + compLength);
    return {
      tag: woff.readUInt32BE(entry),
      checksum: woff.readUInt32BE(entry + 16),
      data: compLength < origLength ? inflateSync(stored) : stored,
    };
  });
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const header = Buffer.alloc(12 + numTables * 16);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(searchRange, 6);
  header.writeUInt16BE(entrySelector, 8);
  header.writeUInt16BE(numTables * 16 - searchRange, 10);
  const bodies: Buffer[] = [];
  let offset = header.length;
  tables.forEach((table, index) => {
    const record = 12 + index * 16;
    header.writeUInt32BE(table.tag, record);
    header.writeUInt32BE(table.checksum, record + 4);
    header.writeUInt32BE(offset, record + 8);
    header.writeUInt32BE(table.data.length, record + 12);
    const padded = Buffer.alloc((table.data.length + 3) & ~3);
    table.data.copy(padded);
    bodies.push(padded);
    offset += padded.length;
  });
  return Buffer.concat([header, ...bodies]);
}

/** A shipped font file, unpacked once, as the data URL react-pdf's font store accepts. */
const fontSource = (name: string) =>
  `data:font/ttf;base64,${woffToSfnt(readFileSync(path.join(fontsDir, `${name}.woff`))).toString('base64')}`;

let registered = false;

/**
 * Registers the shipped IBM Plex files (fonts/*.woff, OFL) with react-pdf, once per process:
 * the font store is global and keeps each loaded font for every later pack.
 */
export function registerPackFonts(): void {
  if (registered) return;
  Font.register({
    family: SANS,
    fonts: [
      { src: fontSource('IBMPlexSans-Regular'), fontWeight: 400 },
      { src: fontSource('IBMPlexSans-Italic'), fontWeight: 400, fontStyle: 'italic' },
      { src: fontSource('IBMPlexSans-Medium'), fontWeight: 500 },
      { src: fontSource('IBMPlexSans-SemiBold'), fontWeight: 600 },
      { src: fontSource('IBMPlexSans-Bold'), fontWeight: 700 },
    ],
  });
  Font.register({
    family: MONO,
    fonts: [
      { src: fontSource('IBMPlexMono-Regular'), fontWeight: 400 },
      { src: fontSource('IBMPlexMono-Medium'), fontWeight: 500 },
      { src: fontSource('IBMPlexMono-SemiBold'), fontWeight: 600 },
    ],
  });
  // Pack numbers, URLs and readings must never be split with a hyphen: break only at spaces.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
