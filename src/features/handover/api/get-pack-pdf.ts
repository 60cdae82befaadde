import { handoverUrl } from '@/features/handover/api/get-handover';

/*
 * PDFs are not fetched into the page: the browser opens or saves them itself through plain
 * links, which keeps its own viewer, download bar and "open with" choices.
 */

/** An issued pack's sealed PDF, exactly as issued (signed-in download). */
export const packPdfUrl = (packNumber: string) =>
  `/api/packs/${encodeURIComponent(packNumber)}/pdf`;

/** The pack as it would be issued now, from the current record; never numbered or sealed. */
export const handoverPreviewUrl = (siteId: string) => `${handoverUrl(siteId)}/preview.pdf`;
