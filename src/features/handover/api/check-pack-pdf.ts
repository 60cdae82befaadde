import { pdfCheckSchema, type PdfCheck } from '@server/handover/schema';
import { useMutation } from '@tanstack/react-query';

import { verifyApiUrl } from '@/features/handover/api/get-verification';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type CheckPackPdfVariables = { packNumber: string; file: File };

/** Sends a copy of the PDF, as it is, to be compared byte for byte with the issued pack. */
export function checkPackPdf({ packNumber, file }: CheckPackPdfVariables) {
  return api.postFile(`${verifyApiUrl(packNumber)}/check`, file, 'application/pdf', pdfCheckSchema);
}

export const useCheckPackPdf = (mutationConfig?: MutationConfig<PdfCheck, CheckPackPdfVariables>) =>
  useMutation({ ...mutationConfig, mutationFn: checkPackPdf });
