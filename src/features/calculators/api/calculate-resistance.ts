import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

const preferredSchema = z.object({ nearest: z.number(), isPreferred: z.boolean() });

export const resistanceResultSchema = z.object({
  ohms: z.number(),
  code: z.string(),
  spoken: z.string(),
  e12: preferredSchema,
  e24: preferredSchema,
  fourBands: z.array(z.string()).nullable(),
  fiveBands: z.array(z.string()).nullable(),
});
export type ResistanceResult = z.infer<typeof resistanceResultSchema>;

export type ResistanceQuery = { value: string };

/** A resistor value in any notation: ohms, its code, spoken form, preferred values and colours. */
export function calculateResistance(query: ResistanceQuery): Promise<ResistanceResult> {
  return api.post('/api/calc/resistance', query, resistanceResultSchema);
}

export const useCalculateResistance = (
  config: MutationConfig<ResistanceResult, ResistanceQuery> = {},
) => useMutation({ ...config, mutationFn: calculateResistance });
