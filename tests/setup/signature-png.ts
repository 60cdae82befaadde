import { crc32, deflateSync } from 'node:zlib';

function chunk(type: string, data: Buffer) {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/**
 * A small real PNG (PNG specification, ISO/IEC 15948): a dark stroke across a white pad, as
 * signature_pad would export it, as a data URL. `seed` moves the stroke so drawings differ.
 */
export function signaturePng(seed = 0): string {
  const width = 120;
  const height = 40;
  const rows: Buffer[] = [];
  for (let y = 0; y < height; y += 1) {
    const row = Buffer.alloc(1 + width * 4, 0xff);
    row[0] = 0; // filter: none
    for (let x = 0; x < width; x += 1) {
      const curve = Math.round(20 + 12 * Math.sin((x + seed * 7) / 9));
      if (Math.abs(curve - y) <= 1) {
        row.fill(0x14, 1 + x * 4, 1 + x * 4 + 3);
      }
    }
    rows.push(row);
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // RGBA
  const png = Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(Buffer.concat(rows))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
  return `data:image/png;base64,${png.toString('base64')}`;
}
