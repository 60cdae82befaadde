import path from 'node:path';

const EXTENSIONS: Record<string, string> = {
  'image/jpeg': '.jpg',
  'image/png': '.png',
  'image/webp': '.webp',
  'application/pdf': '.pdf',
};

/**
 * A name safe to offer on download: no folders (so "../../etc/passwd" is just "passwd"), no
 * control or reserved characters, a sensible length, and the extension of what the bytes are.
 */
export function sanitiseFileName(original: string, contentType: string): string {
  const base = path.posix.basename(original.replace(/\\/g, '/'));
  const cleaned = base
    .normalize('NFC')
    .replace(/[\p{Cc}\p{Cf}]/gu, '')
    .replace(/[<>:"/\\|?*]/g, '_')
    .replace(/\s+/g, ' ')
    .replace(/^[.\s]+/, '')
    .trim();
  const extension = EXTENSIONS[contentType] ?? '';
  const stem = (cleaned.replace(/\.[^.]*$/, '') || 'file').slice(0, 100);
  return `${stem}${extension}`;
}
