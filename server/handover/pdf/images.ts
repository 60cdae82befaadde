import { PNG } from 'pngjs';
import QRCode from 'qrcode';
import { colours } from './styles';

const PNG_DATA_URL = /^data:image\/png;base64,/;

/**
 * A PNG redrawn without transparency, flattened onto white paper, as a data URL.
 *
 * The PDF writer decodes any PNG with an alpha channel asynchronously and writes its mask
 * whenever the decode finishes, so a transparent image (signature_pad's output is one)
 * lands at a different place in the file from one build to the next. Opaque RGB images are
 * written in step with the page, so the same snapshot always gives the same bytes.
 */
export function opaquePng(png: Buffer): string {
  const image = PNG.sync.read(png);
  const opaque = PNG.sync.write(image, {
    colorType: 2,
    inputColorType: 6,
    inputHasAlpha: true,
    bgColor: { red: 255, green: 255, blue: 255 },
  });
  return `data:image/png;base64,${opaque.toString('base64')}`;
}

/** A signature as drawn (a PNG data URL), made ready for the page. */
export function signatureImage(dataUrl: string): string {
  if (!PNG_DATA_URL.test(dataUrl)) throw new Error('A signature must be a PNG data URL.');
  return opaquePng(Buffer.from(dataUrl.replace(PNG_DATA_URL, ''), 'base64'));
}

/** The cover's QR code: the pack's public verification page. */
export async function verifyQrCode(url: string): Promise<string> {
  const png = await QRCode.toBuffer(url, {
    type: 'png',
    errorCorrectionLevel: 'M',
    margin: 1,
    scale: 8,
    color: { dark: colours.ink, light: '#FFFFFF' },
  });
  return opaquePng(png);
}
