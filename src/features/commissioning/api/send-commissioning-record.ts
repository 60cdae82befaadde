import { z } from 'zod';

import { walkTestSchema } from '@server/commissioning/schema';
import { api } from '@/lib/api-client';

/** The kinds of record made on site; each goes to its own endpoint. */
export type RecordKind = 'walk-test' | 'siting-check' | 'system-test';

const ENDPOINTS: Record<RecordKind, string> = {
  'walk-test': 'walk-tests',
  'siting-check': 'siting-checks',
  'system-test': 'system-tests',
};

const sitingResultSchema = z.object({ created: z.boolean(), allClear: z.boolean() });
const systemTestResultSchema = z.object({ created: z.boolean(), passed: z.boolean() });

export type RecordReply =
  | { kind: 'walk-test'; walkTest: z.infer<typeof walkTestSchema> }
  | { kind: 'siting-check'; allClear: boolean }
  | { kind: 'system-test'; passed: boolean };

/**
 * Sends one commissioning record. Its body carries the key made on the phone, so sending it
 * again after a dropped connection records it once (the API answers 200 with what it has).
 */
export async function sendCommissioningRecord(
  siteId: string,
  kind: RecordKind,
  body: Record<string, unknown>,
): Promise<RecordReply> {
  const url = `/api/sites/${encodeURIComponent(siteId)}/${ENDPOINTS[kind]}`;
  switch (kind) {
    case 'walk-test':
      return { kind, walkTest: await api.post(url, body, walkTestSchema) };
    case 'siting-check':
      return { kind, allClear: (await api.post(url, body, sitingResultSchema)).allClear };
    case 'system-test':
      return { kind, passed: (await api.post(url, body, systemTestResultSchema)).passed };
  }
}
