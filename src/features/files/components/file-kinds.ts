import { ALLOWED_FILE_TYPES, MAX_FILE_BYTES, type SiteFile } from '@server/files/schema';

import { formatFileSize } from '@/lib/file-size';

export const FILE_TYPE_LABELS: Record<SiteFile['contentType'], string> = {
  'image/jpeg': 'JPEG photo',
  'image/png': 'PNG image',
  'image/webp': 'WebP image',
  'application/pdf': 'PDF document',
};

export const ACCEPTED_FILES = [
  ...ALLOWED_FILE_TYPES,
  '.jpg',
  '.jpeg',
  '.png',
  '.webp',
  '.pdf',
].join(',');

export const ACCEPTED_FILES_SENTENCE = `Wardbook keeps JPEG, PNG and WebP photos and PDF documents, up to ${formatFileSize(MAX_FILE_BYTES)} each.`;

const typeByExtension: Record<string, SiteFile['contentType']> = {
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  png: 'image/png',
  webp: 'image/webp',
  pdf: 'application/pdf',
};

/** The id of a file's download link, so focus can land on it after a neighbour is deleted. */
export const downloadLinkId = (file: Pick<SiteFile, 'id'>) => `site-file-${file.id}-download`;

export const isImage = (contentType: string) => contentType.startsWith('image/');

/**
 * A quick check before sending, so nobody waits for a 15 MB upload to be refused. It goes by the
 * browser's type or the name; the API checks the bytes themselves and has the last word.
 */
export function checkFileBeforeUpload(file: File): string | null {
  const extension = file.name.split('.').pop()?.toLowerCase() ?? '';
  const declaredType = (ALLOWED_FILE_TYPES as readonly string[]).includes(file.type)
    ? file.type
    : typeByExtension[extension];
  if (!declaredType) {
    return `${file.name} is not a photo or PDF document. ${ACCEPTED_FILES_SENTENCE}`;
  }
  if (file.size === 0) return `${file.name} is empty. Choose the file again.`;
  if (file.size > MAX_FILE_BYTES) {
    return `${file.name} is ${formatFileSize(file.size)}; the largest file Wardbook accepts is ${formatFileSize(MAX_FILE_BYTES)}. Send a smaller photo or split the document.`;
  }
  return null;
}
