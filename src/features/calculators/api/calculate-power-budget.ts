import { useMutation } from '@tanstack/react-query';

import type { PsuType } from '@server/calc/power';
import { powerBudgetFiguresSchema, type PowerBudgetFigures } from '@/lib/calc-result-schemas';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type PowerBudgetQuery = {
  items: { label: string; quiescentMa: number; alarmMa: number; count?: number }[];
  grade: number;
  psuType: PsuType;
  mainsFailureSignalled?: boolean;
  standbyHoursOverride?: number | null;
  alarmMinutes?: number;
  batteryAh?: number | null;
};

/** The standby battery a list of powered items needs, and whether the fitted one is enough. */
export function calculatePowerBudget(query: PowerBudgetQuery): Promise<PowerBudgetFigures> {
  return api.post('/api/calc/power-budget', query, powerBudgetFiguresSchema);
}

export const useCalculatePowerBudget = (
  config: MutationConfig<PowerBudgetFigures, PowerBudgetQuery> = {},
) => useMutation({ ...config, mutationFn: calculatePowerBudget });
