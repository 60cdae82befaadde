import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export const cableResultSchema = z.object({
  ohmsPerMetre: z.number(),
  loopOhms: z.number(),
  voltsAtDetector: z.number(),
  /** Null when the detector draws nothing, so no run is too long. */
  longestRunMetres: z.number().nullable(),
});
export type CableResult = z.infer<typeof cableResultSchema>;

export type CableQuery = {
  core?: '7/0.2' | '16/0.2';
  areaMm2?: number;
  runMetres: number;
  coresPerLeg?: number;
  temperatureC?: number;
  supplyVolts?: number;
  currentMa: number;
  minimumVolts?: number;
};

/** Copper cable: resistance per metre, the run's loop resistance and the volts left. */
export function calculateCable(query: CableQuery): Promise<CableResult> {
  return api.post('/api/calc/cable', query, cableResultSchema);
}

export const useCalculateCable = (config: MutationConfig<CableResult, CableQuery> = {}) =>
  useMutation({ ...config, mutationFn: calculateCable });
