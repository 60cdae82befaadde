import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';

import { LOOP_STATES } from '@server/commissioning/schema';
import type { LoopWiring } from '@server/zones/schema';
import { bandSchema } from '@/lib/calc-result-schemas';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export const loopResultSchema = z.object({
  cableOhms: z.number(),
  bands: z.array(bandSchema),
  problems: z.array(z.string()),
  classification: z
    .object({
      state: z.enum(LOOP_STATES),
      band: z.enum(['short_circuit', 'normal', 'alarm', 'open_circuit']),
      marginOhms: z.number().nullable(),
    })
    .nullable(),
});
export type LoopResult = z.infer<typeof loopResultSchema>;

export type LoopQuery = {
  wiring: LoopWiring;
  tamperOhms?: string;
  alarmOhms?: string;
  tolerance: number;
  cable: {
    core?: '7/0.2' | '16/0.2';
    areaMm2?: number;
    runMetres: number;
    coresPerLeg?: number;
    temperatureC?: number;
  } | null;
  reading?: string | null;
};

/** A loop's bands for its wiring, resistors, tolerance and cable, and what a reading means. */
export function calculateLoop(query: LoopQuery): Promise<LoopResult> {
  return api.post('/api/calc/loop', query, loopResultSchema);
}

export const useCalculateLoop = (config: MutationConfig<LoopResult, LoopQuery> = {}) =>
  useMutation({ ...config, mutationFn: calculateLoop });
