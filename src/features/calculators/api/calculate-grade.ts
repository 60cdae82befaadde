import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export const gradeResultSchema = z.object({
  grade: z.number().nullable(),
  limitedBy: z.array(z.string()),
  ungraded: z.array(z.string()),
});
export type GradeResult = z.infer<typeof gradeResultSchema>;

export type GradeQuery = { components: { label: string; grade: number | null }[] };

/** A system's grade from its parts' grades: the lowest, and which parts set it. */
export function calculateGrade(query: GradeQuery): Promise<GradeResult> {
  return api.post('/api/calc/grade', query, gradeResultSchema);
}

export const useCalculateGrade = (config: MutationConfig<GradeResult, GradeQuery> = {}) =>
  useMutation({ ...config, mutationFn: calculateGrade });
